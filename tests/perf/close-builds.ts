// Close builds at scale: the ranking through the same service the API uses, and the naive way
// (every candidate row into Node, scored and sorted there) for comparison.
import { QueryTypes } from 'sequelize';
import { CAP, TERMS } from '../../src/lib/close/weights';
import { closeQuerySchema } from '../../src/lib/schemas/close';
import { searchClose } from '../../src/lib/server/close/search';
import { planClose, targetFrom } from '../../src/lib/server/close/service';
import { db } from '../../src/lib/server/db/connection';
import { time } from './timing';

function randomQuery(rnd: () => number) {
	const pick = <T>(xs: readonly T[]) => xs[Math.floor(rnd() * xs.length)];
	const around = (x: number, spread: number) => x + (rnd() * 2 - 1) * spread;
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

/** A fair baseline: the same scoring SQL in MariaDB over every representative setup, no band. */
async function unbanded(query: ReturnType<typeof randomQuery>) {
	const plan = await planClose(targetFrom(query), {
		cycle: query.cycle,
		limit: query.limit,
		prefilter: false
	});
	return db().query(plan.sql, { replacements: plan.replacements, type: QueryTypes.SELECT });
}

export async function benchClose(rnd: () => number, runs: number, naiveRuns: number) {
	const queries = Array.from({ length: runs }, () => randomQuery(rnd));
	let i = 0;
	const ours = await time(runs, () => searchClose(queries[i++ % runs]));
	let j = 0;
	const slow = await time(naiveRuns, () => naive(queries[j++ % runs]));
	let k = 0;
	const sameSql = await time(naiveRuns, () => unbanded(queries[k++ % runs]));
	return { ours, slow, sameSql };
}
