// What `npm test` runs once the test stack is up, and the counts it prints at the end.
import fs from 'node:fs';
import path from 'node:path';
import { run } from './proc.js';
import { ROOT, STACK_KEYS } from './profiles.js';
import { retriedTests } from './retried.js';

const readJson = (file) => {
	try {
		return JSON.parse(fs.readFileSync(file, 'utf8'));
	} catch {
		return null;
	}
};

async function vitest(project, env) {
	const out = path.join(env.RUN_DIR, `${project}.json`);
	fs.rmSync(out, { force: true });
	console.log(`\n▸ ${project} tests (vitest)`);
	const code = await run(
		process.execPath,
		[
			'node_modules/vitest/vitest.mjs',
			'run',
			'--project',
			project,
			'--reporter=default',
			'--reporter=json',
			`--outputFile.json=${out}`
		],
		{ cwd: ROOT, env }
	);
	const r = readJson(out);
	return { name: project, code, passed: r?.numPassedTests ?? 0, failed: r ? r.numFailedTests : 1 };
}

async function playwright(env) {
	const out = path.join(env.RUN_DIR, 'browser.json');
	fs.rmSync(out, { force: true });
	console.log('\n▸ browser tests (Playwright in Debian Chromium)');
	const code = await run(
		process.execPath,
		['node_modules/@playwright/test/cli.js', 'test', '--config', 'tests/e2e/playwright.config.ts'],
		{ cwd: ROOT, env: { ...env, E2E_BASE_URL: env.ORIGIN, E2E_JSON: out } }
	);
	const report = readJson(out);
	const s = report?.stats;
	return {
		name: 'browser',
		code,
		passed: s ? s.expected + s.flaky : 0,
		failed: s ? s.unexpected : 1,
		retried: report ? retriedTests(report) : []
	};
}

/** `npm run perf -- --quick` on its own small stack: checks it runs and writes well-formed figures, not its timings. */
async function perfSmoke(env) {
	console.log('\n▸ benchmark smoke run (npm run perf -- --quick)');
	const clean = Object.fromEntries(Object.entries(env).filter(([k]) => !STACK_KEYS.includes(k)));
	// The build this run has just made, instead of a second one.
	const code = await run(process.execPath, ['scripts/stack.js', 'perf', '--quick'], {
		cwd: ROOT,
		env: { ...clean, BUILD_DIR: env.BUILD_DIR, PERF_REUSE_BUILD: '1' }
	});
	const r = readJson(path.join(ROOT, '.data/perf-quick.json'));
	const ok =
		code === 0 &&
		r?.builds === 300 &&
		[
			r.closeBuilds?.p50Ms,
			r.closeBuilds?.p95Ms,
			r.naive?.p50Ms,
			r.ratioNaiveOverOurs,
			...['list', 'speedMap', 'changeEffects', 'search'].flatMap((k) => [r[k]?.p50Ms, r[k]?.p95Ms])
		].every(Number.isFinite) &&
		// The HTTP stage answered every route, and the page stage measured every page.
		r.http?.routes?.length > 0 &&
		r.http.routes.every((x) => Number.isFinite(x.reqPerS) && x.reqPerS > 0) &&
		r.pageWeight?.length > 0 &&
		r.pageWeight.every((x) => Number.isFinite(x.jsKb) && Number.isFinite(x.tbtMs)) &&
		// The edge stage measured the build page through nginx, uncached and cached.
		[r.edge?.oneProcess, r.edge?.twoProcesses, r.edge?.cachedPage, r.edge?.staticViaNginx].every(
			(x) => x?.reqPerS > 0 && x.errors === 0
		);
	if (!ok) console.error('✗ the benchmark smoke run failed or wrote malformed figures');
	return { name: 'perf smoke', code: ok ? 0 : 1, passed: ok ? 1 : 0, failed: ok ? 0 : 1 };
}

/** The checks started at the beginning: waited for here, their output shown if they failed. */
async function checkResult(checks) {
	const { code, log } = await checks;
	console.log(`\n▸ checks (prettier, eslint, svelte-check): ${code === 0 ? 'passed' : 'FAILED'}`);
	if (code !== 0) {
		console.log(fs.readFileSync(log, 'utf8'));
		console.log('  Fix the problems listed above (npm run format fixes layout).');
	}
	return { name: 'checks', code, passed: code === 0 ? 1 : 0, failed: code === 0 ? 0 : 1 };
}

export async function runSuites({ env, checks, build, startApp }) {
	const results = [await vitest('unit', env)];
	// Built before the server-side suites: the security suite starts the production entry on it,
	// the cluster suite serves it from two processes behind nginx.
	await build();
	results.push(await vitest('integration', env), await vitest('security', env));
	results.push(await vitest('cluster', env));
	results.push(await perfSmoke(env));
	await startApp();
	results.push(await playwright(env));
	results.push(await checkResult(checks));

	console.log('\n▸ summary');
	for (const r of results) {
		console.log(`  ${r.name}: ${r.passed} passed, ${r.failed} failed`);
		for (const t of r.retried ?? []) console.log(`    needed a retry: ${t}`);
	}
	const passed = results.reduce((n, r) => n + r.passed, 0);
	const failed = results.reduce((n, r) => n + r.failed, 0);
	const bad = results.some((r) => r.code !== 0) || failed > 0;
	console.log(`total: ${passed} passed, ${failed} failed`);
	return bad ? 1 : 0;
}
