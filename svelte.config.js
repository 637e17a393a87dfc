import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	kit: {
		// The test stack builds into its own folder so `npm test` can run beside a served `npm start`.
		adapter: adapter({ out: process.env.BUILD_DIR ?? 'build' }),
		// Type-check the tests, scripts and Tailwind tokens along with the app.
		typescript: {
			config: (c) => {
				c.include.push('../tests/**/*.ts', '../scripts/**/*.ts', '../tailwind.config.ts');
			}
		}
		// CSRF origin checking stays at SvelteKit's default (on).
	}
};

export default config;
