import { QueryTypes } from 'sequelize';
import { SPEED_MAP_X, type SpeedMapQuery } from '../../stats/schema';
import { db } from '../db/connection';

// The speed map's data: best measured speed against one setup column, one mark per published build
// (its latest measured setup, the one close builds ranks). Two queries whatever the number of builds:
// the matching setups up to MAX_POINTS + 1 (an index scan that stops early when there are more), then
// either the titles of those few, or counts and sums in bins computed by MariaDB — so the browser
// never receives a hundred thousand points. The trend line is least squares from the same sums.

/** Above this many setups the map shows bins instead of points. */
export const MAX_POINTS = 2000;
const Y_BIN_KMH = 2;

export type SpeedPoint = {
	setupId: number;
	buildId: number;
	title: string;
	position: number;
	x: number | string;
	kmh: number;
	pipe: string;
};
export type SpeedBin = {
	x: number | string;
	x2: number | null;
	y: number;
	y2: number;
	pipe: string;
	n: number;
};
export type SpeedMap = {
	x: SpeedMapQuery['x'];
	total: number;
	mode: 'points' | 'bins';
	points: SpeedPoint[];
	bins: SpeedBin[];
	trend: {
		slope: number;
		intercept: number;
		r: number;
		n: number;
		from: number;
		to: number;
	} | null;
};

function filters(q: SpeedMapQuery) {
	const col = SPEED_MAP_X[q.x].col;
	const where = ['s.listed = 1', `${col} IS NOT NULL`];
	const repl: Record<string, unknown> = {};
	if (q.x === 'exhaust') where.push("s.close_pipe <> ''");
	if (q.cycle) (where.push('s.engine_cycle = :cycle'), (repl.cycle = q.cycle));
	if (q.family) (where.push('s.engine_family = :family'), (repl.family = q.family));
	if (q.method.length) (where.push('s.best_run_method IN (:methods)'), (repl.methods = q.method));
	if (q.pipe.length) (where.push('s.close_pipe IN (:pipes)'), (repl.pipes = q.pipe));
	if (q.twoWay) where.push('s.best_run_two_way = 1');
	if (q.closed) where.push("s.best_run_venue = 'closed-course'");
	return {
		col,
		sql: `FROM setups s FORCE INDEX (setups_speed_map) WHERE ${where.join(' AND ')}`,
		repl
	};
}

type Sums = {
	n: number;
	sx: number;
	sy: number;
	sxx: number;
	sxy: number;
	syy: number;
	lo: number;
	hi: number;
};
const noSums = (): Sums => ({
	n: 0,
	sx: 0,
	sy: 0,
	sxx: 0,
	sxy: 0,
	syy: 0,
	lo: Infinity,
	hi: -Infinity
});
function addSums(a: Sums, b: Sums) {
	for (const k of ['n', 'sx', 'sy', 'sxx', 'sxy', 'syy'] as const) a[k] += b[k];
	a.lo = Math.min(a.lo, b.lo);
	a.hi = Math.max(a.hi, b.hi);
}

export async function speedMap(q: SpeedMapQuery, maxPoints = MAX_POINTS): Promise<SpeedMap> {
	const { col, sql, repl } = filters(q);
	const numeric = q.x !== 'exhaust';
	const rows = await db().query<Record<string, unknown>>(
		`SELECT s.id, s.build_id, s.position, ${col} AS x, s.best_run_kmh AS kmh, s.close_pipe AS pipe
		${sql} LIMIT ${maxPoints + 1}`,
		{ replacements: repl, type: QueryTypes.SELECT }
	);
	if (rows.length <= maxPoints) {
		const ids = [...new Set(rows.map((r) => Number(r.build_id)))];
		const titles = ids.length
			? await db().query<{ id: number; title: string }>(
					'SELECT id, title FROM builds WHERE id IN (:ids)',
					{
						replacements: { ids },
						type: QueryTypes.SELECT
					}
				)
			: [];
		const title = new Map(titles.map((t) => [Number(t.id), t.title]));
		const points = rows
			.map((r) => ({
				setupId: Number(r.id),
				buildId: Number(r.build_id),
				position: Number(r.position),
				title: title.get(Number(r.build_id)) ?? '',
				x: numeric ? Number(r.x) : String(r.x),
				kmh: Number(r.kmh),
				pipe: String(r.pipe)
			}))
			.sort((a, b) => a.setupId - b.setupId);
		const sums = noSums();
		if (numeric)
			for (const p of points) {
				const x = p.x as number;
				addSums(sums, {
					n: 1,
					sx: x,
					sy: p.kmh,
					sxx: x * x,
					sxy: x * p.kmh,
					syy: p.kmh * p.kmh,
					lo: x,
					hi: x
				});
			}
		return {
			x: q.x,
			total: points.length,
			mode: 'points',
			points,
			bins: [],
			trend: numeric ? leastSquares(sums) : null
		};
	}
	const w = SPEED_MAP_X[q.x].bin;
	const xBin = numeric ? `FLOOR(${col} / ${w}) * ${w}` : col;
	const x = numeric ? col : '0';
	const groups = await db().query<Record<string, unknown>>(
		`SELECT ${xBin} AS xb, FLOOR(s.best_run_kmh / ${Y_BIN_KMH}) * ${Y_BIN_KMH} AS yb, s.close_pipe AS pipe,
			COUNT(*) AS n, SUM(${x}) AS sx, SUM(s.best_run_kmh) AS sy, SUM(${x} * ${x}) AS sxx,
			SUM(${x} * s.best_run_kmh) AS sxy, SUM(s.best_run_kmh * s.best_run_kmh) AS syy, MIN(${x}) AS lo, MAX(${x}) AS hi
		${sql} GROUP BY 1, 2, 3 ORDER BY 1, 2, 3`,
		{ replacements: repl, type: QueryTypes.SELECT }
	);
	const sums = noSums();
	for (const g of groups)
		addSums(sums, Object.fromEntries(Object.keys(noSums()).map((k) => [k, Number(g[k])])) as Sums);
	return {
		x: q.x,
		total: sums.n,
		mode: 'bins',
		trend: numeric ? leastSquares(sums) : null,
		points: [],
		bins: groups.map((r) => ({
			x: numeric ? Number(r.xb) : String(r.xb),
			x2: numeric ? Number(r.xb) + w : null,
			y: Number(r.yb),
			y2: Number(r.yb) + Y_BIN_KMH,
			pipe: String(r.pipe),
			n: Number(r.n)
		}))
	};
}

/** Ordinary least squares from the sums (any statistics text; the tests check it against simple-statistics). */
export function leastSquares(a: Sums) {
	const { n, sx, sy, sxx, sxy, syy } = a;
	if (n < 5) return null;
	const vx = n * sxx - sx * sx;
	const vy = n * syy - sy * sy;
	// A vertical cloud (one x value) has no slope to speak of.
	if (vx <= 1e-9 * Math.max(1, n * sxx)) return null;
	const slope = (n * sxy - sx * sy) / vx;
	return {
		slope,
		intercept: (sy - slope * sx) / n,
		r: vy > 0 ? (n * sxy - sx * sy) / Math.sqrt(vx * vy) : 0,
		n,
		from: a.lo,
		to: a.hi
	};
}
