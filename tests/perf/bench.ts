// `npm run perf`: seeds N synthetic published builds (fixed seed) into the benchmark database and
// times close builds (with two baselines), the builds list, the speed map, change effects and
// search, each through the function its route calls; then the same app over HTTP (the production
// entry under autocannon) and what each page costs a phone. Figures to the console and to JSON.
import fs from 'node:fs';
import os from 'node:os';
import { closeDb } from '../../src/lib/server/db/connection';
import { startApp } from '../security/support/app';
import { benchClose } from './close-builds';
import { benchCommunity } from './community';
import { benchEdge } from './edge';
import { benchHttp, pagesToWeigh, refusals, type HttpFigure } from './http';
import { benchPageWeight } from './page-weight';
import { mulberry32, seed } from './seed';

const quick = process.argv.includes('--quick');
const N = quick ? 300 : Number(process.env.PERF_BUILDS ?? 100_000);
const RUNS = quick ? 40 : 200;
const NAIVE_RUNS = quick ? 10 : 40;
const out = process.env.PERF_OUT ?? (quick ? '.data/perf-quick.json' : 'tests/perf/last-run.json');
const ms = (x: number) => Number(x.toFixed(2));
const fig = (t: { p50: number; p95: number; p99: number; max: number; runs: number }) => ({
	runs: t.runs,
	p50Ms: ms(t.p50),
	p95Ms: ms(t.p95),
	p99Ms: ms(t.p99),
	maxMs: ms(t.max)
});

const t0 = performance.now();
const seeded = await seed(N, mulberry32(424242), {
	settle: !quick,
	reuse: process.env.PERF_KEEP_DATA === '1'
});
const seedSeconds = (performance.now() - t0) / 1000;
const close = await benchClose(mulberry32(7), RUNS, NAIVE_RUNS);
const community = await benchCommunity(mulberry32(11), RUNS);

// The quick run checks that the stages work (one short round), not their figures. PERF_HTTP=0
// leaves the HTTP and page stages out (the run at a million builds measures the functions).
// PERF_OUT must then name another file: last-run.json is the full run's.
let http: Awaited<ReturnType<typeof benchHttp>> | null = null;
let pages: Awaited<ReturnType<typeof benchPageWeight>> = [];
let edge: Awaited<ReturnType<typeof benchEdge>> | null = null;
// PERF_HTTP=pages: the functions and the pages on a phone only (no load stages), for a quicker
// look at blocking time.
if (process.env.PERF_HTTP === 'pages') {
	const app = await startApp(Number(process.env.PERF_HTTP_PORT ?? 3201));
	try {
		pages = await benchPageWeight(app.origin, await pagesToWeigh(app), quick ? 1 : 5);
	} finally {
		await app.stop();
	}
} else if (process.env.PERF_HTTP !== '0') {
	const app = await startApp(Number(process.env.PERF_HTTP_PORT ?? 3201));
	try {
		http = await benchHttp(app, {
			rounds: quick ? 1 : 3,
			// Few connections for two seconds: even the slowest page answers several times on a
			// busy machine (with ten for one second, a slow page could finish none).
			seconds: quick ? 2 : 10,
			warmupSeconds: quick ? 0 : 3,
			connections: quick ? 4 : 50
		});
		// Five openings a page: one opening to the next varies by a factor of two on a shared machine.
		pages = await benchPageWeight(app.origin, http.pages, quick ? 1 : 5);
	} finally {
		await app.stop();
	}
	// The same build page through nginx: one process, two, then the edge cache.
	edge = await benchEdge(
		http.pages.find((p) => p.name.startsWith('build page'))!.path,
		http.staticAsset,
		{
			rounds: quick ? 1 : 3,
			seconds: quick ? 2 : 10,
			warmupSeconds: quick ? 0 : 3,
			connections: quick ? 4 : 50
		}
	);
}

const TARGETS = {
	at: 100_000,
	closeBuildsP95Ms: 25,
	ratio: 20,
	listP95Ms: 50,
	speedMapP95Ms: 100,
	changeEffectsP95Ms: 150,
	searchP95Ms: 25,
	buildPageOfStatic: 0.1,
	readP99Ms: 300,
	pageJsKb: 80,
	pageTbtMs: 200,
	twoOverOneProcess: 1.5,
	cachedBuildPageOfStatic: 0.5
};

const result = {
	date: new Date().toISOString(),
	machine: {
		cpu: os.cpus()[0]?.model ?? 'unknown',
		cores: os.cpus().length,
		memoryGiB: Math.round(os.totalmem() / 2 ** 30),
		node: process.version
	},
	builds: N,
	setups: seeded.setups,
	parts: seeded.parts,
	summaries: seeded.summaries,
	quick,
	seedSeconds: Number(seedSeconds.toFixed(1)),
	// Timed on the database kept from an earlier run (PERF_KEEP_DATA=1), not seeded anew.
	reusedData: seeded.reused,
	closeBuilds: fig(close.ours),
	naive: fig(close.slow),
	sameSqlNoBand: fig(close.sameSql),
	ratioNaiveOverOurs: Number((close.slow.p50 / close.ours.p50).toFixed(1)),
	ratioSameSqlOverOurs: Number((close.sameSql.p50 / close.ours.p50).toFixed(1)),
	list: fig(community.list),
	speedMap: fig(community.speedMap),
	changeEffects: fig(community.changeEffects),
	search: fig(community.search),
	vocabularyLoadMs: ms(community.vocabularyMs),
	http: http && { ...http, pages: undefined },
	pageWeight: pages,
	edge,
	targets: TARGETS
};

const row = (f: ReturnType<typeof fig>, target: number | null) => ({
	p50_ms: f.p50Ms,
	p95_ms: f.p95Ms,
	p99_ms: f.p99Ms,
	max_ms: f.maxMs,
	runs: f.runs,
	p95_target_ms: target ?? '—'
});
console.table({
	'close builds (ours)': row(result.closeBuilds, TARGETS.closeBuildsP95Ms),
	'naive (all rows into Node)': row(result.naive, null),
	'same scoring SQL, no band': row(result.sameSqlNoBand, null),
	'builds list, 3 filters': row(result.list, TARGETS.listP95Ms),
	'speed map': row(result.speedMap, TARGETS.speedMapP95Ms),
	'change effects': row(result.changeEffects, TARGETS.changeEffectsP95Ms),
	search: row(result.search, TARGETS.searchP95Ms)
});
console.log(
	`builds ${N} (setups ${seeded.setups}, parts ${seeded.parts}), naive/ours ${result.ratioNaiveOverOurs}×, same SQL without the band/ours ${result.ratioSameSqlOverOurs}×, vocabulary loaded in ${result.vocabularyLoadMs} ms, seeded in ${result.seedSeconds} s (summaries filled in ${seeded.summaries.filledMs} ms: ${seeded.summaries.binRows} speed-map bins, ${seeded.summaries.countRows} change-effect counts)`
);
const httpTable = (figures: HttpFigure[]) =>
	console.table(
		Object.fromEntries(
			figures.map((r) => [
				r.route,
				{
					'req/s': r.reqPerS,
					'of static': `${(r.ofStatic * 100).toFixed(1)} %`,
					p50_ms: r.p50Ms,
					p99_ms: r.p99Ms,
					max_ms: r.maxMs,
					errors: r.errors,
					non2xx: r.non2xx
				}
			])
		)
	);
if (http) {
	console.log(
		`\nHTTP: ${http.connections} connections, ${http.seconds} s a route, ${http.rounds} round(s), medians; static asset ${http.staticAsset} at ${http.staticReqPerS} req/s`
	);
	httpTable(http.routes);
	console.log('\nThe read routes made afresh (no kept answers):');
	httpTable(http.madeAfresh);
}
for (const [status, body] of refusals) console.log(`write refused with ${status}: ${body}`);
if (pages.length) console.log('\nPages on a phone (390 px, CPU 4× slower):');
if (pages.length)
	console.table(
		Object.fromEntries(
			pages.map((p) => [p.page, { js_kB: p.jsKb, tbt_ms: p.tbtMs, scripts: p.scripts }])
		)
	);
if (edge) {
	console.log(
		`\nThrough nginx (${edge.connections} connections): build page ${edge.oneProcess.reqPerS} req/s with one app process, ${edge.twoProcesses.reqPerS} with two (${edge.twoOverOne}×, target ${TARGETS.twoOverOneProcess}×); with the edge cache ${edge.cachedPage.reqPerS} req/s against the static asset's ${edge.staticViaNginx.reqPerS} (${(edge.cachedOfStatic * 100).toFixed(1)} %, target ${TARGETS.cachedBuildPageOfStatic * 100} %)`
	);
	console.table({
		'build page, 1 process': edge.oneProcess,
		'build page, 2 processes': edge.twoProcesses,
		'build page, edge cache': edge.cachedPage,
		'static asset from nginx': edge.staticViaNginx
	});
}
fs.writeFileSync(out, JSON.stringify(result, null, 2) + '\n');
console.log(`PERF JSON ${out}`);
await closeDb();
