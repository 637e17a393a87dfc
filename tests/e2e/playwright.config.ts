import { defineConfig } from '@playwright/test';

const baseURL = process.env.E2E_BASE_URL ?? 'http://127.0.0.1:3100';

export default defineConfig({
	testDir: '.',
	outputDir: '../../.data/test-results',
	fullyParallel: false,
	workers: 2,
	forbidOnly: Boolean(process.env.CI),
	retries: process.env.CI ? 1 : 0,
	timeout: 30_000,
	reporter: [['list'], ['json', { outputFile: process.env.E2E_JSON ?? '../../.data/e2e.json' }]],
	use: {
		baseURL,
		// The browser tests read as an en-GB reader; the locale tests set their own.
		locale: 'en-GB',
		trace: 'on-first-retry',
		launchOptions: {
			// Debian's Chromium, never a downloaded browser.
			executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
			args: [
				'--headless',
				'--no-sandbox',
				'--disable-gpu',
				'--disable-quic',
				'--no-first-run',
				'--disable-background-networking',
				'--disable-component-update',
				'--disable-sync'
			]
		}
	},
	projects: [
		{ name: 'chromium', use: { browserName: 'chromium' } },
		// The security suite's browser checks live beside its server checks.
		{
			name: 'security',
			testDir: '../security',
			testMatch: /\.spec\.ts$/,
			use: { browserName: 'chromium' }
		}
	]
});
