import { QueryTypes } from 'sequelize';
import type { SpeedMapQuery } from '../../schemas/stats';
import { METHODS, SPEED_MAP_X } from '../../stats/speed-map-axes';
import { AXES, CYCLES, PIPES, Y_BIN_KMH, codeOf } from '../../stats/summary-sql';
import { db } from '../db/connection';
import { whileUnchanged } from './kept';

// The speed map's data: best measured speed against one setup column, one mark per published build
// (its latest measured setup, the one close builds ranks). At most two queries whatever the number of
// builds: counts and sums in bins, computed by MariaDB over one covering index (the trend line is
// least squares from those sums); then, when few enough to draw one by one, the points themselves.
// The browser never receives a hundred thousand points.

/** Above this many setups the map shows bins instead of points. */
export const MAX_POINTS = 2000;
// Bin key = (x bin + KEY_X0) · KEY_X + speed bin · KEY_Y + pipe (1–4): x bins may be negative (places
// below sea level), speed bins stay under 10,000 and there are fewer than 10 pipe values.
const KEY_X0 = 100_000;
const KEY_X = 100_000;
const KEY_Y = 10;

export type SpeedPoint = {
	setupId: number;
	buildId: number;
	title: string;
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
	/** Why no trend line is drawn over numbers, in words; null when one is drawn. */
	trendHidden: string | null;
};

// The index leads with the filters as lists of points (every value when a filter is not set), so a
// filter further along still narrows the scan instead of being checked row by row.
const ALL = {
	method: METHODS.map((m) => m.value) as string[],
	pipe: PIPES,
	twoWay: [0, 1],
	venue: ['closed-course', 'private-ground', 'other'],
	cycle: [...CYCLES]
};

function filters(q: SpeedMapQuery) {
	const col = SPEED_MAP_X[q.x].col;
	const repl: Record<string, unknown> = {
		methods: q.method.length ? q.method : ALL.method,
		pipes: q.pipe.length ? q.pipe : ALL.pipe,
		twoWay: q.twoWay ? [1] : ALL.twoWay,
		cycles: q.cycle ? [q.cycle] : ALL.cycle
	};
	// Unfiltered, a plain scan of the index is cheaper than 192 little ranges.
	const narrowed = q.method.length || q.pipe.length || q.twoWay || q.closed || q.cycle || q.family;
	const where = [
		's.listed = 1',
		...(narrowed
			? [
					's.best_run_method IN (:methods)',
					's.close_pipe IN (:pipes)',
					's.best_run_two_way IN (:twoWay)',
					// A run whose place is not recorded counts unless closed courses are asked for.
					...(q.closed ? ["s.best_run_venue = 'closed-course'"] : []),
					's.engine_cycle IN (:cycles)'
				]
			: []),
		`${col} IS NOT NULL`
	];
	if (q.x === 'exhaust') where.push("s.close_pipe <> ''");
	if (q.family) {
		where.push('s.engine_family = :family');
		repl.family = q.family;
	}
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
	const w = SPEED_MAP_X[q.x].bin;
	const pipes = PIPES;
	// The bins come from the summary kept on every write (src/lib/stats/summary-sql.ts): one row per
	// (x bin, speed bin, pipe) for each combination of filters, '' where a filter is not set.
	// One integer per bin (x bin, speed bin, pipe) groups far faster than three columns with a string.
	const groups = await db().query<Record<string, unknown>>(
		`SELECT (xb + ${KEY_X0}) * ${KEY_X} + yb * ${KEY_Y} + pipe AS k,
			SUM(n) AS n, SUM(sx) AS sx, SUM(sy) AS sy, SUM(sxx) AS sxx, SUM(sxy) AS sxy, SUM(syy) AS syy,
			MIN(lo) AS lo, MAX(hi) AS hi
		FROM speed_map_bins
		WHERE axis = :axis AND method IN (:methods) AND cycle = :cycle AND two_way = :twoWay
			AND venue = :venue AND pipe IN (:pipes) AND n > 0
			AND family = ${q.family ? 'COALESCE((SELECT id FROM summary_families WHERE name = :family), -1)' : '0'}
		GROUP BY 1 ORDER BY NULL`,
		{
			replacements: {
				axis: AXES.indexOf(q.x) + 1,
				methods: q.method.length ? q.method.map((m) => codeOf(ALL.method, m)) : [0],
				cycle: q.cycle ? codeOf(CYCLES, q.cycle) : 0,
				family: q.family ?? '',
				twoWay: q.twoWay ? 1 : 0,
				venue: q.closed ? 1 : 0,
				pipes: (q.pipe.length ? q.pipe : PIPES).map((p) => codeOf(PIPES, p))
			},
			type: QueryTypes.SELECT
		}
	);
	const sums = noSums();
	for (const g of groups)
		addSums(sums, Object.fromEntries(Object.keys(noSums()).map((k) => [k, Number(g[k])])) as Sums);
	const occupied = new Map<number, number>();
	for (const g of groups) {
		const xb = Math.floor(Number(g.k) / KEY_X) - KEY_X0;
		occupied.set(xb, (occupied.get(xb) ?? 0) + Number(g.n));
	}
	const spread = numeric ? xSpread([...occupied.keys()]) : null;
	const fitted = numeric && !spread ? leastSquares(sums) : null;
	const trend = fitted;
	const trendHidden = !numeric
		? null
		: spread
			? spread
			: fitted
				? null
				: 'No trend line: fewer than five builds, or every one at the same value.';
	if (sums.n <= maxPoints) {
		// Few enough to draw one by one: the points themselves, with their builds' titles.
		const rows = sums.n
			? await db().query<Record<string, unknown>>(
					`SELECT s.id, s.build_id, ${col} AS x, s.best_run_kmh AS kmh, s.close_pipe AS pipe, b.title
					${sql.replace('WHERE', 'JOIN builds b ON b.id = s.build_id WHERE')} ORDER BY s.id`,
					{ replacements: repl, type: QueryTypes.SELECT }
				)
			: [];
		const points = rows.map((r) => ({
			setupId: Number(r.id),
			buildId: Number(r.build_id),
			title: String(r.title),
			x: numeric ? Number(r.x) : String(r.x),
			kmh: Number(r.kmh),
			pipe: String(r.pipe)
		}));
		return { x: q.x, total: points.length, mode: 'points', points, bins: [], trend, trendHidden };
	}
	return {
		x: q.x,
		total: sums.n,
		mode: 'bins',
		trend,
		trendHidden,
		points: [],
		bins: groups
			.map((r) => {
				const k = Number(r.k);
				const xb = (Math.floor(k / KEY_X) - KEY_X0) * w;
				const pipe = pipes[(k % KEY_Y) - 1] ?? '';
				const y = Math.floor((k % KEY_X) / KEY_Y) * Y_BIN_KMH;
				return {
					x: numeric ? xb : pipe,
					x2: numeric ? xb + w : null,
					y,
					y2: y + Y_BIN_KMH,
					pipe,
					n: Number(r.n)
				};
			})
			.sort((a, b) => (a.x < b.x ? -1 : a.x > b.x ? 1 : a.y - b.y || a.pipe.localeCompare(b.pipe)))
	};
}

/**
 * Why the x values do not spread enough for a line through them to mean anything, or null when they
 * do. A line through two clusters only joins their means: it needs values at four or more bins, and
 * no empty stretch between them wider than half the range.
 */
export function xSpread(bins: number[]): string | null {
	const xs = [...new Set(bins)].sort((a, b) => a - b);
	if (xs.length < 4)
		return 'No trend line: the builds sit at too few different values for a line to say anything.';
	const range = xs[xs.length - 1] - xs[0];
	const widest = Math.max(...xs.slice(1).map((x, i) => x - xs[i]));
	if (widest > range / 2)
		return 'No trend line: the builds fall into separate clusters, and a line between clusters only joins their averages.';
	return null;
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

/** The speed map as pages and the API show it: kept while no published sheet changes (kept.ts). */
export function speedMapKept(q: SpeedMapQuery): Promise<SpeedMap> {
	return whileUnchanged(`speed-map ${JSON.stringify(q)}`, () => speedMap(q));
}
