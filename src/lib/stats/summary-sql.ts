import { CHANGE_KINDS } from '../sheet/change-kinds';
import { EXHAUST_TYPES } from '../sheet/fields';
import { METHODS, SPEED_MAP_X, type SpeedMapX } from './speed-map-axes';

// The statements that keep the speed map's bins and change effects' counts (tables
// speed_map_bins and effect_counts, see their migration) in step with the setups. Plain text
// builders shared by the code that keeps them on every write (server/derived/stat-summaries.ts),
// the migration that fills them once and the benchmark's seed, so all three write the same rows.
//
// A summary row is a sum over setups, so it is kept by adding what a build contributes now and
// taking away what it contributed before. What it contributed before is kept in stat_marks: a copy
// of the build's setup columns as they were last added (setups change in several statements of a
// save, so their old values are gone by the time the summaries are brought up to date).

/** The setup columns the summaries read, as named in setups and stat_marks alike. */
export const MARK_COLUMNS = [
	'id',
	'build_id',
	'listed',
	'any_listed',
	'best_run_method',
	'close_pipe',
	'best_run_two_way',
	'best_run_venue',
	'engine_cycle',
	'engine_family',
	'best_run_kmh',
	'displacement_cc',
	'final_drive_ratio',
	'overall_ratio',
	'sea_level_jet',
	'roller_total_g',
	'best_run_elevation_m',
	'change_kind',
	'effect_kmh'
] as const;
const COLS = MARK_COLUMNS.join(', ');

/** Speed bins are this wide (km/h); the speed map reads the same constant. */
export const Y_BIN_KMH = 2;
/** Which setups count: the speed map's marks and the pairs change effects may list. */
export const MARKED = 'listed = 1 OR any_listed = 1';

// Bins are keyed by small integers (grouping millions of rows by wide strings is what makes a fill
// slow): each axis, method, cycle and pipe by its place in these lists (from 1; 0 is "any"), each
// engine family by its row in summary_families, whose unique name compares as setups' own column.
export const AXES = Object.keys(SPEED_MAP_X) as SpeedMapX[];
export const CYCLES = ['two-stroke', 'four-stroke'] as const;
/** Pipe codes from 1, '' (not given) first: the speed map reads the same list. */
export const PIPES = ['', ...EXHAUST_TYPES.map((o) => o.value)];
const list = (xs: readonly string[]) => xs.map((x) => `'${x}'`).join(', ');
const METHOD_CODE = `FIELD(p.best_run_method, ${list(METHODS.map((m) => m.value))})`;
const CYCLE_CODE = `FIELD(p.engine_cycle, ${list(CYCLES)})`;
/** A code in one of the lists above, or 0 when the value is not in it. */
export const codeOf = (xs: readonly string[], v: string) => xs.indexOf(v) + 1;

// Each filter is either "any" (0) or one value: every mark is added to each combination of its own
// values and "any" (a small cube), so a read with any filters set reads one row per (x bin, speed
// bin, pipe). Bits: method, cycle, engine family, two-way only, closed course only.
const MASKS = Array.from({ length: 32 }, (_, m) => `SELECT ${m} AS m`).join(' UNION ALL ');
const axisRows = (axes: SpeedMapX[]) =>
	axes
		.map((axis) => `SELECT ${AXES.indexOf(axis) + 1} AS axis, ${SPEED_MAP_X[axis].bin} AS w`)
		.join(' UNION ALL ');
const X = `CASE a.axis ${AXES.map((axis, i) =>
	axis === 'exhaust'
		? `WHEN ${i + 1} THEN IF(s.close_pipe <> '', 0, NULL)`
		: `WHEN ${i + 1} THEN ${SPEED_MAP_X[axis].col}`
).join(' ')} END`;

/**
 * Adds to the bins what `source` holds, each row signed by its `sg` column (1 to add, −1 to take
 * away). With `ordered`, rows go in key order, so two writers lock shared bins in the same order.
 */
function speedBins(source: string, axes: SpeedMapX[], ordered: boolean) {
	const keys = '1, 2, 3, 4, 5, 6, 7, 8, 9';
	return `INSERT INTO speed_map_bins (axis, method, cycle, family, two_way, venue, xb, yb, pipe, n, sx, sy, sxx, sxy, syy, lo, hi)
	SELECT p.axis, IF(m.m & 1, ${METHOD_CODE}, 0), IF(m.m & 2, ${CYCLE_CODE}, 0),
		IF(m.m & 4, p.family, 0), IF(m.m & 8, 1, 0), IF(m.m & 16, 1, 0),
		IF(p.w > 0, FLOOR(p.x / p.w), 0), FLOOR(p.best_run_kmh / ${Y_BIN_KMH}),
		FIELD(p.close_pipe, ${list(PIPES)}),
		SUM(p.sg), SUM(p.sg * p.x), SUM(p.sg * p.best_run_kmh), SUM(p.sg * p.x * p.x),
		SUM(p.sg * p.x * p.best_run_kmh), SUM(p.sg * p.best_run_kmh * p.best_run_kmh),
		MIN(IF(p.sg > 0, p.x, NULL)), MAX(IF(p.sg > 0, p.x, NULL))
	FROM (SELECT s.*, COALESCE(f.id, 0) AS family, a.axis, a.w, ${X} AS x
		FROM ${source} s LEFT JOIN summary_families f ON f.name = s.engine_family
		CROSS JOIN (${axisRows(axes)}) a WHERE s.listed = 1) p
	CROSS JOIN (${MASKS}) m
	WHERE p.x IS NOT NULL
		AND NOT (m.m & 1 AND ${METHOD_CODE} = 0)
		AND NOT (m.m & 2 AND ${CYCLE_CODE} = 0)
		AND NOT (m.m & 4 AND p.family = 0)
		AND NOT (m.m & 8 AND NOT COALESCE(p.best_run_two_way, 0))
		AND NOT (m.m & 16 AND COALESCE(p.best_run_venue, '') <> 'closed-course')
	GROUP BY ${keys} ORDER BY ${ordered ? keys : 'NULL'}
	ON DUPLICATE KEY UPDATE
		-- lo and hi first, while n is still the old count: an emptied bin starts again from the new
		-- values; taking a value away leaves them (they stay inside the bin, see stat-summaries.ts).
		lo = IF(n <= 0, VALUES(lo), COALESCE(LEAST(lo, VALUES(lo)), lo)),
		hi = IF(n <= 0, VALUES(hi), COALESCE(GREATEST(hi, VALUES(hi)), hi)),
		n = n + VALUES(n), sx = sx + VALUES(sx), sy = sy + VALUES(sy), sxx = sxx + VALUES(sxx),
		sxy = sxy + VALUES(sxy), syy = syy + VALUES(syy)`;
}

const KINDS = list(CHANGE_KINDS.map((k) => k.kind));

/**
 * Change effects' counts: grain 0 counts the pairs left out (no speed change that counts), grain 1
 * the pairs at each speed change in hundredths of a km/h (the precision steps are stored at, so the
 * quartiles read from it are exact), grain 2 the same per whole km/h, to find a rank quickly.
 */
function effectCounts(source: string, ordered: boolean) {
	return `INSERT INTO effect_counts (kind, grain, v, n)
	SELECT p.change_kind, g.grain,
		CASE g.grain WHEN 0 THEN 0 WHEN 1 THEN p.c ELSE FLOOR(p.c / 100) END, SUM(p.sg)
	FROM (SELECT s.sg, s.change_kind, s.effect_kmh, ROUND(s.effect_kmh * 100) AS c FROM ${source} s
		WHERE s.any_listed = 1 AND s.change_kind IN (${KINDS})) p
	JOIN (SELECT 0 AS grain UNION ALL SELECT 1 UNION ALL SELECT 2) g ON (g.grain = 0) = (p.effect_kmh IS NULL)
	GROUP BY 1, 2, 3 ORDER BY ${ordered ? '1, 2, 3' : 'NULL'}
	ON DUPLICATE KEY UPDATE n = n + VALUES(n)`;
}

const families = (where: string) =>
	`INSERT IGNORE INTO summary_families (name)
	SELECT DISTINCT engine_family FROM setups WHERE ${where} AND listed = 1 AND engine_family <> ''`;

/** The statements that move the summaries from a build's marks to its setups as they are now. */
export function deltaStatements(): string[] {
	const source = `(SELECT -1 AS sg, ${COLS} FROM stat_marks WHERE build_id = :buildId
		UNION ALL SELECT 1, ${COLS} FROM setups WHERE build_id = :buildId AND (${MARKED}))`;
	return [
		families('build_id = :buildId'),
		speedBins(source, AXES, true),
		effectCounts(source, true),
		'DELETE FROM stat_marks WHERE build_id = :buildId',
		`INSERT INTO stat_marks (${COLS}) SELECT ${COLS} FROM setups WHERE build_id = :buildId AND (${MARKED})`
	];
}

/**
 * The statements that fill the summaries from every setup (on empty tables), an axis at a time,
 * with room to group in memory: a fill groups a hundred rows or so for each listed build.
 */
export function fillStatements(): string[] {
	const source = `(SELECT 1 AS sg, ${COLS} FROM setups WHERE ${MARKED})`;
	const roomy = 'SET STATEMENT max_heap_table_size = 1073741824, tmp_table_size = 1073741824 FOR';
	return [
		families('1 = 1'),
		...AXES.map((axis) => `${roomy} ${speedBins(source, [axis], false)}`),
		`${roomy} ${effectCounts(source, false)}`,
		`INSERT INTO stat_marks (${COLS}) SELECT ${COLS} FROM setups WHERE ${MARKED}`
	];
}
