// `npm run perf`: seeds N synthetic published builds (fixed seed) into the benchmark database and
// times close builds (with the naive baseline), the builds list, the speed map, change effects and
// search, each through the function its route calls. Figures to the console and to a JSON file.
import fs from 'node:fs';
import os from 'node:os';
import { closeDb } from '../../src/lib/server/db/connection';
import { benchClose } from './close-builds';
import { benchCommunity } from './community';
import { mulberry32, seed } from './seed';

const quick = process.argv.includes('--quick');
const N = quick ? 1000 : Number(process.env.PERF_BUILDS ?? 100_000);
const RUNS = quick ? 40 : 200;
const NAIVE_RUNS = quick ? 10 : 40;
const out = process.env.PERF_OUT ?? (quick ? '.data/perf-quick.json' : 'tests/perf/last-run.json');
const ms = (x: number) => Number(x.toFixed(2));
const fig = (t: { p50: number; p95: number; runs: number }) => ({
	runs: t.runs,
	p50Ms: ms(t.p50),
	p95Ms: ms(t.p95)
});

const t0 = performance.now();
const seeded = await seed(N, mulberry32(424242));
const seedSeconds = (performance.now() - t0) / 1000;
const close = await benchClose(mulberry32(7), RUNS, NAIVE_RUNS);
const community = await benchCommunity(mulberry32(11), RUNS);

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
	quick,
	seedSeconds: Number(seedSeconds.toFixed(1)),
	closeBuilds: fig(close.ours),
	naive: fig(close.slow),
	ratioNaiveOverOurs: Number((close.slow.p50 / close.ours.p50).toFixed(1)),
	list: fig(community.list),
	speedMap: fig(community.speedMap),
	changeEffects: fig(community.changeEffects),
	search: fig(community.search),
	vocabularyLoadMs: ms(community.vocabularyMs),
	targets: {
		at: 100_000,
		closeBuildsP95Ms: 25,
		ratio: 20,
		listP95Ms: 50,
		speedMapP95Ms: 100,
		changeEffectsP95Ms: 150,
		searchP95Ms: 50
	}
};
const row = (f: { p50Ms: number; p95Ms: number; runs: number }, target: number | null) => ({
	p50_ms: f.p50Ms,
	p95_ms: f.p95Ms,
	runs: f.runs,
	p95_target_ms: target ?? '—'
});
console.table({
	'close builds (ours)': row(result.closeBuilds, 25),
	'naive (all rows into Node)': row(result.naive, null),
	'builds list, 3 filters': row(result.list, 50),
	'speed map': row(result.speedMap, 100),
	'change effects': row(result.changeEffects, 150),
	search: row(result.search, 50)
});
console.log(
	`builds ${N} (setups ${seeded.setups}, parts ${seeded.parts}), naive/ours ${result.ratioNaiveOverOurs}×, vocabulary loaded in ${result.vocabularyLoadMs} ms, seeded in ${result.seedSeconds} s`
);
fs.writeFileSync(out, JSON.stringify(result, null, 2) + '\n');
console.log(`PERF JSON ${out}`);
await closeDb();
