import { QueryTypes } from 'sequelize';
import { SPEED_MAP_X, type SpeedMapQuery } from '../../stats/schema';
import { db } from '../db/connection';

// The speed map's data: best measured speed against one setup column, over every published setup
// with a run. Two queries whatever the number of setups: one aggregate (count and the sums for a
// least-squares trend line), then either the points themselves (few enough to draw one by one) or
// counts in bins computed by MariaDB, so the browser never receives a hundred thousand points.

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
	const where = ['s.any_listed = 1', `${col} IS NOT NULL`];
	const repl: Record<string, unknown> = {};
	if (q.x === 'exhaust') where.push("s.close_pipe <> ''");
	if (q.cycle) (where.push('s.engine_cycle = :cycle'), (repl.cycle = q.cycle));
	if (q.family) (where.push('s.engine_family = :family'), (repl.family = q.family));
	if (q.method.length) (where.push('s.best_run_method IN (:methods)'), (repl.methods = q.method));
	if (q.pipe.length) (where.push('s.close_pipe IN (:pipes)'), (repl.pipes = q.pipe));
	if (q.twoWay) where.push('s.best_run_two_way = 1');
	if (q.closed) where.push("s.best_run_venue = 'closed-course'");
	return { col, where: `WHERE ${where.join(' AND ')}`, repl };
}

export async function speedMap(q: SpeedMapQuery): Promise<SpeedMap> {
	const { col, where, repl } = filters(q);
	const from = 'FROM setups s FORCE INDEX (setups_speed_map)';
	const sql = `${from} ${where}`;
	const numeric = q.x !== 'exhaust';
	const x = numeric ? col : '0';
	const [agg] = await db().query<Record<string, number | null>>(
		`SELECT COUNT(*) AS n, SUM(${x}) AS sx, SUM(s.best_run_kmh) AS sy, SUM(${x} * ${x}) AS sxx,
			SUM(${x} * s.best_run_kmh) AS sxy, SUM(s.best_run_kmh * s.best_run_kmh) AS syy,
			MIN(${x}) AS lo, MAX(${x}) AS hi ${sql}`,
		{ replacements: repl, type: QueryTypes.SELECT }
	);
	const total = Number(agg.n);
	const trend = numeric ? leastSquares(agg) : null;
	if (total <= MAX_POINTS) {
		const rows = await db().query<Record<string, unknown>>(
			`SELECT s.id, s.build_id, s.position, ${col} AS x, s.best_run_kmh AS kmh, s.close_pipe AS pipe, b.title
			${from} JOIN builds b ON b.id = s.build_id ${where} ORDER BY s.id`,
			{ replacements: repl, type: QueryTypes.SELECT }
		);
		return {
			x: q.x,
			total,
			mode: 'points',
			trend,
			bins: [],
			points: rows.map((r) => ({
				setupId: Number(r.id),
				buildId: Number(r.build_id),
				position: Number(r.position),
				title: String(r.title),
				x: numeric ? Number(r.x) : String(r.x),
				kmh: Number(r.kmh),
				pipe: String(r.pipe)
			}))
		};
	}
	const w = SPEED_MAP_X[q.x].bin;
	const xBin = numeric ? `FLOOR(${col} / ${w}) * ${w}` : col;
	const rows = await db().query<Record<string, unknown>>(
		`SELECT ${xBin} AS x, FLOOR(s.best_run_kmh / ${Y_BIN_KMH}) * ${Y_BIN_KMH} AS y, s.close_pipe AS pipe, COUNT(*) AS n
		${sql} GROUP BY 1, 2, 3 ORDER BY 1, 2, 3`,
		{ replacements: repl, type: QueryTypes.SELECT }
	);
	return {
		x: q.x,
		total,
		mode: 'bins',
		trend,
		points: [],
		bins: rows.map((r) => ({
			x: numeric ? Number(r.x) : String(r.x),
			x2: numeric ? Number(r.x) + w : null,
			y: Number(r.y),
			y2: Number(r.y) + Y_BIN_KMH,
			pipe: String(r.pipe),
			n: Number(r.n)
		}))
	};
}

/** Ordinary least squares from the sums (any statistics text; checked against simple-statistics). */
export function leastSquares(a: Record<string, number | null>) {
	const n = Number(a.n);
	if (n < 5) return null;
	const [sx, sy, sxx, sxy, syy] = [a.sx, a.sy, a.sxx, a.sxy, a.syy].map(Number);
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
		from: Number(a.lo),
		to: Number(a.hi)
	};
}
