import { describe, expect, it } from 'vitest';
import { retriedTests } from '../../scripts/lib/retried.js';

// The shape is Playwright's JSON reporter (https://playwright.dev/docs/test-reporters#json-reporter).
describe('the test summary names every test that needed a retry', () => {
	it('finds flaky tests at any depth, and nothing else', () => {
		const report = {
			suites: [
				{
					title: 'moderation.spec.ts',
					specs: [
						{
							title: 'a reported comment goes through the desk',
							file: 'moderation.spec.ts',
							line: 20,
							tests: [{ status: 'flaky', results: [{ retry: 0 }, { retry: 1 }] }]
						},
						{
							title: 'steady',
							file: 'moderation.spec.ts',
							line: 90,
							tests: [{ status: 'expected', results: [{ retry: 0 }] }]
						}
					],
					suites: [
						{
							title: 'without JavaScript',
							specs: [
								{
									title: 'still saves',
									file: 'moderation.spec.ts',
									line: 120,
									tests: [{ status: 'unexpected', results: [{ retry: 0 }, { retry: 1 }] }]
								}
							]
						}
					]
				}
			]
		};
		expect(retriedTests(report)).toEqual([
			'moderation.spec.ts:20 a reported comment goes through the desk',
			'moderation.spec.ts:120 without JavaScript › still saves'
		]);
	});
});
