import type { Config } from 'tailwindcss';

// Squishline's workshop-notebook tokens. One accent: "gasket copper", the colour of an
// annealed copper head gasket. Everything else is paper and graphite. Each token is a CSS
// variable (its light and dark values are in app.css), so both themes are the same design.
export default {
	content: ['./src/**/*.{html,js,svelte,ts}'],
	theme: {
		extend: {
			colors: {
				paper: {
					DEFAULT: 'var(--sl-paper)',
					deep: 'var(--sl-paper-deep)',
					edge: 'var(--sl-paper-edge)',
					field: 'var(--sl-paper-field)'
				},
				graphite: {
					DEFAULT: 'var(--sl-graphite)',
					soft: 'var(--sl-graphite-soft)',
					faint: 'var(--sl-graphite-faint)'
				},
				copper: {
					DEFAULT: 'var(--sl-copper)',
					deep: 'var(--sl-copper-deep)',
					wash: 'var(--sl-copper-wash)'
				},
				rule: 'var(--sl-rule)',
				caution: { DEFAULT: 'var(--sl-caution)', wash: 'var(--sl-caution-wash)' },
				fault: { DEFAULT: 'var(--sl-fault)', wash: 'var(--sl-fault-wash)' },
				sound: { DEFAULT: 'var(--sl-sound)', wash: 'var(--sl-sound-wash)' }
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
