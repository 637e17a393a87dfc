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
		},
		// Cross-site form posts are refused by our own copy of SvelteKit's check
		// (src/lib/server/origin-check.ts), which also lets RFC 8058 one-click unsubscribes in.
		csrf: { trustedOrigins: ['*'] },
		// Scripts only from this origin, each page's own inline start-up script by nonce. Styles may
		// be inline (charts set style attributes); member content can never carry one (markdown.ts).
		csp: {
			// Hashes of the inline scripts SvelteKit writes, not per-request nonces: the same page is
			// then the same bytes, so its ETag holds and a reader who has it gets 304.
			mode: 'hash',
			directives: {
				'default-src': ['self'],
				'script-src': ['self'],
				'style-src': ['self', 'unsafe-inline'],
				'img-src': ['self', 'data:', 'blob:'],
				'font-src': ['self'],
				'connect-src': ['self'],
				'object-src': ['none'],
				'base-uri': ['self'],
				'form-action': ['self'],
				'frame-ancestors': ['none']
			}
		}
	}
};

export default config;
