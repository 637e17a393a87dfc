// Reads Playwright's JSON report (https://playwright.dev/docs/test-reporters#json-reporter).

/**
 * @typedef {{ status?: string, results?: { retry: number }[] }} ReportTest
 * @typedef {{ title: string, file: string, line: number, tests?: ReportTest[] }} ReportSpec
 * @typedef {{ title?: string, specs?: ReportSpec[], suites?: ReportSuite[] }} ReportSuite
 */

/**
 * Tests that needed a retry: a flake hides behind a passing retry, so the summary names it.
 * @param {{ suites?: ReportSuite[] }} report
 * @returns {string[]}
 */
export function retriedTests(report) {
	/** @type {string[]} */
	const names = [];
	/** @param {ReportSuite} suite @param {string[]} trail */
	const walk = (suite, trail) => {
		const here = suite.title ? [...trail, suite.title] : trail;
		for (const spec of suite.specs ?? [])
			for (const t of spec.tests ?? [])
				if (t.status === 'flaky' || (t.results ?? []).some((r) => r.retry > 0))
					names.push(`${spec.file}:${spec.line} ${[...here.slice(1), spec.title].join(' › ')}`);
		for (const child of suite.suites ?? []) walk(child, here);
	};
	for (const suite of report.suites ?? []) walk(suite, []);
	return names;
}
