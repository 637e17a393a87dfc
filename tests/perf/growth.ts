// How each function-level figure grows from one benchmark run to a larger one: reads two of
// bench.ts's JSON files and prints a Markdown table (p50 and p95 of each, and p95's growth factor).
//   npx tsx tests/perf/growth.ts tests/perf/last-run.json tests/perf/last-run-1m.json
import fs from 'node:fs';

type Fig = { p50Ms: number; p95Ms: number };
type Run = { builds: number; vocabularyLoadMs: number } & Record<string, Fig | unknown>;

const [small, large] = process.argv
	.slice(2)
	.map((f) => JSON.parse(fs.readFileSync(f, 'utf8')) as Run);
if (!small || !large) throw new Error('usage: growth.ts <smaller run>.json <larger run>.json');

const FIGURES: [string, string, number | null][] = [
	['closeBuilds', 'close builds', 50],
	['list', 'builds list, 3 filters', 50],
	['search', 'search', 50],
	['speedMap', 'speed map', 200],
	['changeEffects', 'change effects', 200]
];
const n = (x: number) => x.toLocaleString('en-GB');
const f = (x: number) => x.toFixed(1);
const lines = [
	`| figure | p50 at ${n(small.builds)} | p95 at ${n(small.builds)} | p50 at ${n(large.builds)} | p95 at ${n(large.builds)} | p95 growth | target at ${n(large.builds)} |`,
	'| --- | --- | --- | --- | --- | --- | --- |'
];
for (const [key, label, target] of FIGURES) {
	const a = small[key] as Fig;
	const b = large[key] as Fig;
	const growth = b.p95Ms / a.p95Ms;
	lines.push(
		`| ${label} | ${f(a.p50Ms)} | ${f(a.p95Ms)} | ${f(b.p50Ms)} | ${f(b.p95Ms)} | ${growth.toFixed(2)}× ${growth <= 2 ? '✓' : '✗'} | p95 ≤ ${target} ${b.p95Ms <= target! ? '✓' : '✗'}, growth ≤ 2× |`
	);
}
const va = small.vocabularyLoadMs;
const vb = large.vocabularyLoadMs;
lines.push(
	`| typo vocabulary, first load | ${f(va)} | | ${f(vb)} | | ${(vb / va).toFixed(2)}× ${vb / va <= 2 ? '✓' : '✗'} | < 1,000 ${vb < 1000 ? '✓' : '✗'} |`
);
console.log(lines.join('\n'));
