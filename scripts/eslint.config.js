import path from 'node:path';
import js from '@eslint/js';
import svelte from 'eslint-plugin-svelte';
import globals from 'globals';
import ts from 'typescript-eslint';
import svelteConfig from '../svelte.config.js';
import { boundaries } from './lint/boundaries.js';

export default ts.config(
	{
		ignores: [
			'.svelte-kit/',
			'build/',
			'.data/',
			'fake-storage/data/',
			'fake-storage/test-data/',
			'test-results/'
		]
	},
	js.configs.recommended,
	...ts.configs.recommended,
	...svelte.configs.recommended,
	{ languageOptions: { globals: { ...globals.browser, ...globals.node } } },
	{
		files: ['**/*.ts', '**/*.svelte', '**/*.svelte.ts'],
		languageOptions: {
			parserOptions: {
				// SvelteKit keeps the service worker out of the app's tsconfig (it runs with the
				// WebWorker library, not the DOM's); it is linted on its own.
				projectService: { allowDefaultProject: ['src/service-worker.ts'] },
				tsconfigRootDir: path.resolve(import.meta.dirname, '..'),
				extraFileExtensions: ['.svelte'],
				parser: ts.parser,
				svelteConfig
			}
		},
		rules: {
			'@typescript-eslint/no-floating-promises': 'error',
			// The app is served at the site root (no `paths.base`), so plain hrefs are already right.
			'svelte/no-navigation-without-resolve': 'off',
			'@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_' }]
		}
	},
	...boundaries
);
