// The Markdown tables of tests/perf/README.md from one run's JSON (bench.ts writes it):
//   npx tsx tests/perf/report.ts tests/perf/last-run.json
import fs from 'node:fs';

type Fig = { p50Ms: number; p95Ms: number; p99Ms: number; maxMs: number };
const run = JSON.parse(fs.readFileSync(process.argv[2] ?? 'tests/perf/last-run.json', 'utf8'));
const t = run.targets;
const f = (x: number) => x.toFixed(1);
const n = (x: number) => Math.round(x).toLocaleString('en-GB');
const ok = (pass: boolean) => (pass ? '✓' : '✗');

const fns: [string, string, number | null][] = [
	['closeBuilds', 'close builds', t.closeBuildsP95Ms],
	['sameSqlNoBand', 'same scoring SQL, no band', null],
	['naive', 'naive (all rows into Node)', null],
	['list', 'builds list, 3 filters', t.listP95Ms],
	['speedMap', 'speed map', t.speedMapP95Ms],
	['changeEffects', 'change effects', t.changeEffectsP95Ms],
	['search', 'search (one in five misspelt)', t.searchP95Ms]
];
const out = [
	'| figure | p50 | p95 | p99 | max | target p95 |',
	'| --- | --- | --- | --- | --- | --- |',
	...fns.map(([k, label, target]) => {
		const x = run[k] as Fig;
		return `| ${label} | ${f(x.p50Ms)} | ${f(x.p95Ms)} | ${f(x.p99Ms)} | ${f(x.maxMs)} | ${target === null ? '—' : `≤ ${target} ${ok(x.p95Ms <= target)}`} |`;
	}),
	`| typo vocabulary, first load | ${f(run.vocabularyLoadMs)} | | | | < 1,000 ${ok(run.vocabularyLoadMs < 1000)} |`,
	''
];
if (run.http) {
	out.push(
		`HTTP: static asset ${n(run.http.staticReqPerS)} req/s.`,
		'',
		'| route | req/s | of static | p50 ms | p99 ms | max ms | errors | non-2xx |',
		'| --- | --- | --- | --- | --- | --- | --- | --- |',
		...run.http.routes.map(
			(r: Record<string, number | string>) =>
				`| ${r.route} | ${n(r.reqPerS as number)} | ${((r.ofStatic as number) * 100).toFixed(1)} % | ${n(r.p50Ms as number)} | ${n(r.p99Ms as number)}${String(r.route).startsWith('save') ? '' : ` ${ok((r.p99Ms as number) <= t.readP99Ms)}`} | ${n(r.maxMs as number)} | ${r.errors} | ${r.non2xx} |`
		),
		''
	);
	if (run.http.madeAfresh)
		out.push(
			'Made afresh (the client sends Cache-Control: no-cache, so no kept answer is served):',
			'',
			'| route | req/s | of static | p50 ms | p99 ms | max ms | errors | non-2xx |',
			'| --- | --- | --- | --- | --- | --- | --- | --- |',
			...run.http.madeAfresh.map(
				(r: Record<string, number | string>) =>
					`| ${r.route} | ${n(r.reqPerS as number)} | ${((r.ofStatic as number) * 100).toFixed(1)} % | ${n(r.p50Ms as number)} | ${n(r.p99Ms as number)} | ${n(r.maxMs as number)} | ${r.errors} | ${r.non2xx} |`
			),
			''
		);
}
if (run.pageWeight?.length) {
	out.push(
		'| page | JS, kB compressed | total blocking time, ms (median) | each opening |',
		'| --- | --- | --- | --- |',
		...run.pageWeight.map(
			(p: { page: string; jsKb: number; tbtMs: number; tbtRunsMs: number[] }) =>
				`| ${p.page} | ${f(p.jsKb)} ${ok(p.jsKb <= t.pageJsKb)} | ${p.tbtMs} ${ok(p.tbtMs <= t.pageTbtMs)} | ${p.tbtRunsMs.join(', ')} |`
		)
	);
}
if (run.edge) {
	const e = run.edge;
	const row = (label: string, x: Record<string, number>, note = '') =>
		`| ${label} | ${n(x.reqPerS)} | ${n(x.p50Ms)} | ${n(x.p99Ms)} | ${x.errors} | ${note} |`;
	out.push(
		'',
		`Through nginx (${e.connections} connections, medians of ${e.rounds} rounds of ${e.seconds} s):`,
		'',
		'| build page | req/s | p50 ms | p99 ms | errors | |',
		'| --- | --- | --- | --- | --- | --- |',
		row('one app process, no edge cache', e.oneProcess),
		row(
			'two app processes, no edge cache',
			e.twoProcesses,
			`${e.twoOverOne}× one process (target ≥ ${t.twoOverOneProcess}× ${ok(e.twoOverOne >= t.twoOverOneProcess)})`
		),
		row(
			'two app processes, edge cache',
			e.cachedPage,
			`${(e.cachedOfStatic * 100).toFixed(1)} % of the static asset (target ≥ ${t.cachedBuildPageOfStatic * 100} % ${ok(e.cachedOfStatic >= t.cachedBuildPageOfStatic)})`
		),
		row('static asset, from nginx', e.staticViaNginx)
	);
}
console.log(out.join('\n'));
