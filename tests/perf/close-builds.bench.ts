// `npm run perf`: close-builds at scale. Seeds N synthetic published builds (fixed seed) into the
// benchmark database, times the ranking through the same service the API uses, and times the naive
// way (every candidate row into Node, scored and sorted there) for comparison.
import fs from 'node:fs';
import os from 'node:os';
import { QueryTypes } from 'sequelize';
import { CAP, TERMS } from '../../src/lib/close/weights';
import { closeQuerySchema } from '../../src/lib/close/schema';
import { searchClose } from '../../src/lib/server/close/search';
import { targetFrom } from '../../src/lib/server/close/service';
import { closeDb, db } from '../../src/lib/server/db/connection';

const quick = process.argv.includes('--quick');
const N = quick ? 1000 : Number(process.env.PERF_BUILDS ?? 100_000);
const RUNS = quick ? 40 : 200;
const NAIVE_RUNS = quick ? 10 : 40;
const out = process.env.PERF_OUT ?? (quick ? '.data/perf-quick.json' : 'tests/perf/last-run.json');

function mulberry32(seed: number) {
	return () => {
		seed = (seed + 0x6d2b79f5) | 0;
		let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
		t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
}
const rnd = mulberry32(424242);
const pick = <T>(xs: readonly T[]) => xs[Math.floor(rnd() * xs.length)];
const around = (x: number, spread: number) => x + (rnd() * 2 - 1) * spread;
const q = (v: unknown) =>
	v === null ? 'NULL' : typeof v === 'number' ? String(v) : `'${String(v).replace(/'/g, "''")}'`;

async function seed() {
	const s = db();
	await s.query('SET FOREIGN_KEY_CHECKS = 0');
	for (const t of ['photos', 'parts', 'runs', 'setups', 'builds'])
		await s.query(`TRUNCATE TABLE ${t}`);
	await s.query('SET FOREIGN_KEY_CHECKS = 1');
	await s.query(
		`INSERT IGNORE INTO users (id, name, email, role, units, mail_comments, mail_shop, mail_news, created_at, updated_at) VALUES ('00000000-0000-4000-8000-00000000beef', 'Bench owner', 'bench@perf.squishline.test', 'member', 'metric', 0, 0, 0, NOW(), NOW())`
	);
	const batch = 1000;
	for (let start = 0; start < N; start += batch) {
		const b: string[] = [];
		const st: string[] = [];
		for (let i = start; i < Math.min(N, start + batch); i++) {
			const id = i + 1;
			const cls = rnd();
			const cc = cls < 0.4 ? around(49.3, 1) : cls < 0.85 ? around(68, 3) : around(80, 6);
			const cycle = rnd() < 0.9 ? 'two-stroke' : 'four-stroke';
			const best = cc < 55 ? around(52, 7) : around(95, 15);
			b.push(
				`(${id}, '00000000-0000-4000-8000-00000000beef', ${q(`Bench build ${id}`)}, '', ${q(cycle)}, 'published', 'visible', 1, ${best.toFixed(1)}, ${Math.floor(rnd() * 90000)}, 1, 1, NOW(), NOW())`
			);
			st.push(
				`(${id}, ${id}, 1, 'bench', '{}', ${q(cycle)}, 1, 1, ${q(pick(['stock', 'sport', 'expansion-chamber']))}, ${cc.toFixed(2)}, ${pick([12, 14, 17, 19, 21])}, ${around(10, 2).toFixed(3)}, ${around(1450, 150).toFixed(1)}, ${around(35, 10).toFixed(1)}, ${around(92, 15).toFixed(1)}, ${Math.round(rnd() * 2000)}, ${best.toFixed(1)}, 'gps-logger', NOW(), NOW())`
			);
		}
		await s.query(
			`INSERT INTO builds (id, owner_id, title, story, engine_cycle, publication, moderation, setup_count, best_speed_kmh, parts_total_minor, run_count, version, created_at, updated_at) VALUES ${b.join(',')}`
		);
		await s.query(
			`INSERT INTO setups (id, build_id, position, change_note, config, engine_cycle, listed, any_listed, exhaust_type, displacement_cc, carb_bore_mm, final_drive_ratio, tyre_circumference_mm, roller_total_g, sea_level_jet, best_run_elevation_m, best_run_kmh, best_run_method, created_at, updated_at) VALUES ${st.join(',')}`
		);
	}
	await s.query('ANALYZE TABLE setups, builds');
}

function randomQuery() {
	return closeQuerySchema.parse({
		cycle: rnd() < 0.9 ? 'two-stroke' : 'four-stroke',
		cc: rnd() < 0.9 ? pick([50, 70, 80]) + Math.round(rnd() * 4) : undefined,
		exhaust: rnd() < 0.7 ? pick(['stock', 'sport', 'expansion-chamber']) : undefined,
		carb: rnd() < 0.6 ? pick([12, 17, 19]) : undefined,
		tyre: rnd() < 0.6 ? pick(['120/70-12', '130/60-13', '3.50-10']) : undefined,
		driver: rnd() < 0.5 ? pick([13, 14, 15]) : undefined,
		driven: 43,
		rollers: rnd() < 0.5 ? Math.round(around(36, 8)) : undefined,
		elevation: rnd() < 0.6 ? Math.round(rnd() * 2000) : undefined,
		limit: 10
	});
}

/** The way not to do it: fetch every candidate, score and sort in Node. */
async function naive(query: ReturnType<typeof randomQuery>) {
	const t = targetFrom(query);
	const rows = await db().query<Record<string, number | string | null>>(
		'SELECT id, build_id, displacement_cc, exhaust_type, carb_bore_mm, final_drive_ratio, tyre_circumference_mm, roller_total_g, sea_level_jet, best_run_elevation_m, best_run_kmh FROM setups WHERE listed = 1 AND engine_cycle = :cycle',
		{ replacements: { cycle: query.cycle }, type: QueryTypes.SELECT }
	);
	const term =
		(v: number | undefined, col: string, k: keyof typeof TERMS) =>
		(r: Record<string, number | string | null>) =>
			v === undefined
				? 0
				: TERMS[k].weight *
					Math.min(r[col] === null ? CAP : Math.abs(Number(r[col]) - v) / TERMS[k].scale, CAP);
	const terms = [
		term(t.cc, 'displacement_cc', 'displacement'),
		term(t.carb, 'carb_bore_mm', 'carb'),
		term(t.finalDrive, 'final_drive_ratio', 'finalDrive'),
		term(t.tyreMm, 'tyre_circumference_mm', 'tyre'),
		term(t.rollers, 'roller_total_g', 'rollers'),
		term(t.elevation, 'best_run_elevation_m', 'elevation')
	];
	return rows
		.map((r) => ({
			r,
			score:
				terms.reduce((a, f) => a + f(r), 0) +
				(t.exhaust ? (r.exhaust_type === t.exhaust ? 0 : TERMS.exhaust.weight) : 0)
		}))
		.sort((a, b) => a.score - b.score)
		.slice(0, 10);
}

const pct = (xs: number[], p: number) =>
	[...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor((p / 100) * xs.length))];
async function time(n: number, fn: () => Promise<unknown>) {
	const ms: number[] = [];
	for (let i = 0; i < n; i++) {
		const t0 = performance.now();
		await fn();
		ms.push(performance.now() - t0);
	}
	return { p50: pct(ms, 50), p95: pct(ms, 95) };
}

const t0 = performance.now();
await seed();
const seedSeconds = (performance.now() - t0) / 1000;
const queries = Array.from({ length: RUNS }, randomQuery);
for (const x of queries.slice(0, 10)) await searchClose(x); // warm the pool and the buffer pool
let i = 0;
const ours = await time(RUNS, () => searchClose(queries[i++ % RUNS]));
let j = 0;
const slow = await time(NAIVE_RUNS, () => naive(queries[j++ % RUNS]));
const result = {
	date: new Date().toISOString(),
	machine: {
		cpu: os.cpus()[0]?.model ?? 'unknown',
		cores: os.cpus().length,
		memoryGiB: Math.round(os.totalmem() / 2 ** 30),
		node: process.version
	},
	builds: N,
	quick,
	seedSeconds: Number(seedSeconds.toFixed(1)),
	closeBuilds: {
		runs: RUNS,
		p50Ms: Number(ours.p50.toFixed(2)),
		p95Ms: Number(ours.p95.toFixed(2))
	},
	naive: {
		runs: NAIVE_RUNS,
		p50Ms: Number(slow.p50.toFixed(2)),
		p95Ms: Number(slow.p95.toFixed(2))
	},
	ratioNaiveOverOurs: Number((slow.p50 / ours.p50).toFixed(1)),
	targets: { closeBuildsP95Ms: 25, ratio: 20, at: 100_000 }
};
console.table({
	'close builds (ours)': {
		p50_ms: result.closeBuilds.p50Ms,
		p95_ms: result.closeBuilds.p95Ms,
		runs: RUNS
	},
	'naive (all rows into Node)': {
		p50_ms: result.naive.p50Ms,
		p95_ms: result.naive.p95Ms,
		runs: NAIVE_RUNS
	}
});
console.log(
	`builds ${N}, naive/ours ${result.ratioNaiveOverOurs}×, seeded in ${result.seedSeconds} s`
);
fs.writeFileSync(out, JSON.stringify(result, null, 2) + '\n');
console.log(`PERF JSON ${out}`);
await closeDb();
