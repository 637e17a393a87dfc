import type { Config } from 'tailwindcss';

// Squishline's workshop-notebook tokens. One accent: "gasket copper", the colour of an
// annealed copper head gasket. Everything else is paper and graphite.
export default {
	content: ['./src/**/*.{html,js,svelte,ts}'],
	theme: {
		extend: {
			colors: {
				paper: { DEFAULT: '#f6f1e7', deep: '#ece4d4', edge: '#d8cdb8' },
				graphite: { DEFAULT: '#2a2926', soft: '#55524b', faint: '#8a857a' },
				copper: { DEFAULT: '#a8471f', deep: '#7f3514', wash: '#f3dccd' },
				rule: '#c9d6dc',
				caution: { DEFAULT: '#8a5a00', wash: '#f7e7bf' },
				fault: { DEFAULT: '#9b1c1c', wash: '#f6d5d0' },
				sound: { DEFAULT: '#2f5d3a', wash: '#d9ead9' }
			},
			fontFamily: {
				sans: ['"Source Sans 3"', 'system-ui', 'sans-serif'],
				mono: ['"IBM Plex Mono"', 'ui-monospace', 'monospace']
			},
			borderRadius: { sheet: '3px' },
			spacing: { gutter: '1.25rem' },
			maxWidth: { sheet: '72rem' }
		}
	}
} satisfies Config;
