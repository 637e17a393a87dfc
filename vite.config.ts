import { sveltekit } from '@sveltejs/kit/vite';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [tailwindcss(), sveltekit()],
	server: { host: '127.0.0.1' },
	build: {
		// Quiet build logs: superforms' optional validator packages trip the circular-import check.
		rolldownOptions: {
			checks: { circularDependency: false, pluginTimings: false },
			onwarn(warning, warn) {
				if (warning.code === 'CIRCULAR_DEPENDENCY' || warning.code === 'EMPTY_BUNDLE') return;
				warn(warning);
			}
		}
	},
	preview: { host: '127.0.0.1' },
	test: {
		projects: [
			{
				extends: true,
				test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' }
			},
			{
				extends: true,
				test: {
					name: 'integration',
					include: ['tests/integration/**/*.test.ts'],
					environment: 'node',
					// One real database: files run one after another so they never race on shared rows.
					fileParallelism: false,
					testTimeout: 30_000,
					hookTimeout: 60_000
				}
			},
			{
				extends: true,
				test: {
					name: 'security',
					include: ['tests/security/**/*.test.ts'],
					environment: 'node',
					fileParallelism: false,
					testTimeout: 60_000,
					hookTimeout: 120_000
				}
			},
			{
				extends: true,
				test: {
					// Starts its own cluster (nginx, two app processes, primary and replica).
					name: 'cluster',
					include: ['tests/cluster/**/*.test.ts'],
					environment: 'node',
					fileParallelism: false,
					testTimeout: 90_000,
					hookTimeout: 180_000
				}
			}
		]
	}
});
