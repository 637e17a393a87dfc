import { QueryTypes } from 'sequelize';
import { BAND, CAP, TERMS } from '../../close/weights';
import { reasons, type Candidate, type Target } from '../../close/reasons';
import type { CloseQuery } from '../../schemas/close';
import * as t from '../../tuning';
import { EXHAUST_TYPES } from '../../sheet/fields';
import { db } from '../db/connection';
import { models } from '../db/models';

type Row = {
	id: number;
	build_id: number;
	cc: number | null;
	exhaust: string | null;
	carb: number | null;
	fd: number | null;
	tyre: number | null;
	rollers: number | null;
	jet: number | null;
	elev: number | null;
	best: number | null;
	score: number;
};

const PIPES = ['', ...EXHAUST_TYPES.map((o) => o.value)];

const NUMERIC: [keyof Target, keyof typeof TERMS, string][] = [
	['cc', 'displacement', 's.displacement_cc'],
	['carb', 'carb', 's.carb_bore_mm'],
	['finalDrive', 'finalDrive', 's.final_drive_ratio'],
	['tyreMm', 'tyre', 's.tyre_circumference_mm'],
	['rollers', 'rollers', 's.roller_total_g'],
	['jet', 'jet', 's.sea_level_jet'],
	['elevation', 'elevation', 's.best_run_elevation_m']
];

/** The comparison point from the base-scooter fields (empty ones stay undefined and drop out). */
export function targetFrom(q: CloseQuery): Target {
	// Stored final drives multiply both gear stages, so only a complete pair of stages compares.
	const stages: t.GearStage[] | null =
		q.driver && q.driven && q.driver2 && q.driven2
			? [
					[q.driver, q.driven],
					[q.driver2, q.driven2]
				]
			: null;
	let tyreMm: number | undefined;
	try {
		tyreMm = q.tyre ? t.tyreCircumferenceMm(q.tyre) : undefined;
	} catch {
		tyreMm = undefined;
	}
	return {
		cc: q.cc,
		exhaust: q.exhaust,
		carb: q.carb,
		finalDrive: q.ratio ?? (stages ? t.finalDriveRatio(stages) : undefined),
		tyreMm,
		rollers: q.rollers,
		elevation: q.elevation
	};
}

/** A build's representative setup as the comparison point ("where does my build sit?"). */
export async function targetFromBuild(
	buildId: number
): Promise<{ target: Target; cycle: 'two-stroke' | 'four-stroke' } | null> {
	const s = await models().Setup.findOne({ where: { buildId, listed: true } });
	if (!s) return null;
	const v = (x: number | null) => x ?? undefined;
	return {
		cycle: s.engineCycle,
		target: {
			cc: v(s.displacementCc),
			exhaust: s.exhaustType ?? undefined,
			carb: v(s.carbBoreMm),
			finalDrive: v(s.finalDriveRatio),
			tyreMm: v(s.tyreCircumferenceMm),
			rollers: v(s.rollerTotalG),
			jet: v(s.seaLevelJet),
			elevation: v(s.bestRunElevationM)
		}
	};
}

/**
 * Plans the ranking of the published setups nearest to `target`: a prefilter on (flag, cycle,
 * displacement band) over a covering index, scored on the stored derived columns. The band is the
 * narrowest that holds enough builds; every candidate band is counted in one query (each count
 * stops at the threshold, so it reads a bounded number of index entries at any data size).
 */
export async function planClose(
	target: Target,
	opts: {
		cycle: string;
		all?: boolean;
		limit: number;
		excludeBuild?: number;
		/** The benchmark's fair baseline turns the band off: the same scoring over every setup. */
		prefilter?: boolean;
	}
) {
	const flag = opts.all ? 'any_listed' : 'listed';
	const index = opts.all ? 'setups_close_all' : 'setups_close_representative';
	const repl: Record<string, unknown> = { cycle: opts.cycle, limit: opts.limit, cap: CAP };
	const terms: string[] = [];
	for (const [key, term, col] of NUMERIC) {
		const v = target[key];
		if (typeof v !== 'number') continue;
		repl[`v_${key}`] = v;
		terms.push(
			`${TERMS[term].weight} * LEAST(COALESCE(ABS(${col} - :v_${key}) / ${TERMS[term].scale}, :cap), :cap)`
		);
	}
	if (target.exhaust) {
		repl.v_exhaust = target.exhaust;
		terms.push(`${TERMS.exhaust.weight} * COALESCE(PIPE_COL <> :v_exhaust, 1)`);
	}
	const score = terms.length ? terms.join(' + ') : '0';
	const exclude = opts.excludeBuild ? 'AND s.build_id <> :exclude' : '';
	if (opts.excludeBuild) repl.exclude = opts.excludeBuild;
	// Prefilter: a band on the displacement (or, without one, on the carburettor bore), with the named
	// pipe type while it alone holds enough builds; the band doubles while too few builds fall inside.
	const lead =
		typeof target.cc === 'number' ? 'cc' : typeof target.carb === 'number' ? 'carb' : null;
	type Plan = { band: number | null; samePipe: boolean; key: number };
	const indexFor = (p: Plan) =>
		lead === 'carb' && p.band !== null
			? opts.all
				? 'setups_close_all_by_carb'
				: 'setups_close_by_carb'
			: p.samePipe
				? opts.all
					? 'setups_close_all_by_exhaust'
					: 'setups_close_by_exhaust'
				: index;
	// Each plan's bounds have their own names (:lo3, :pipes3), so all plans fit one statement.
	const bandSql = (p: Plan) =>
		p.band === null
			? p.samePipe
				? 'AND s.exhaust_type = :v_exhaust'
				: ''
			: lead === 'cc'
				? `${p.samePipe ? 'AND s.exhaust_type = :v_exhaust' : ''} AND s.displacement_cc BETWEEN :lo${p.key} AND :hi${p.key}`
				: // Pipe types as a list of points, so the bore range applies inside each.
					`AND s.close_pipe IN (:pipes${p.key}) AND s.carb_bore_mm BETWEEN :lo${p.key} AND :hi${p.key}`;
	const where = (p: Plan) => `s.${flag} = 1 AND s.engine_cycle = :cycle ${bandSql(p)} ${exclude}`;
	const centre = lead === 'cc' ? target.cc! : lead === 'carb' ? target.carb! : 0;
	const plans: Plan[] = [];
	const first = lead === 'cc' ? BAND.initialCc : BAND.initialCarbMm;
	const bands: (number | null)[] = lead
		? [...Array.from({ length: BAND.widenings }, (_, k) => first * 2 ** k), null]
		: [null];
	for (const samePipe of target.exhaust ? [true, false] : [false])
		for (const band of bands) {
			const p = { band, samePipe, key: plans.length };
			plans.push(p);
			repl[`pipes${p.key}`] = samePipe ? [target.exhaust] : PIPES;
			repl[`lo${p.key}`] = centre - (band ?? 0);
			repl[`hi${p.key}`] = centre + (band ?? 0);
		}
	// The last plan (no band, any pipe) needs no count: it is what is left.
	const probed = opts.prefilter === false ? [] : plans.slice(0, -1);
	let plan = plans[plans.length - 1];
	if (probed.length) {
		const counts = probed.map(
			(p) =>
				`(SELECT COUNT(*) FROM (SELECT 1 FROM setups s FORCE INDEX (${indexFor(p)}) WHERE ${where(p)} LIMIT ${BAND.minCandidates}) x) AS n${p.key}`
		);
		const [n] = await db().query<Record<string, number>>(`SELECT ${counts.join(',\n')}`, {
			replacements: repl,
			type: QueryTypes.SELECT
		});
		plan = probed.find((p) => Number(n[`n${p.key}`]) >= BAND.minCandidates) ?? plan;
	}
	// The carburettor-led index carries the pipe type as close_pipe only: read it there, so the scan
	// stays on the index.
	const pipeCol = indexFor(plan).includes('carb') ? "NULLIF(s.close_pipe, '')" : 's.exhaust_type';
	const sql = `SELECT s.id, s.build_id, s.displacement_cc AS cc, ${pipeCol} AS exhaust, s.carb_bore_mm AS carb, s.final_drive_ratio AS fd,
			s.tyre_circumference_mm AS tyre, s.roller_total_g AS rollers, s.sea_level_jet AS jet, s.best_run_elevation_m AS elev,
			s.best_run_kmh AS best, (${score.replaceAll('PIPE_COL', pipeCol)}) AS score
		FROM setups s FORCE INDEX (${indexFor(plan)})
		WHERE ${where(plan)}
		ORDER BY score, s.id LIMIT :limit`;
	return {
		sql,
		replacements: repl,
		band: lead === 'cc' ? plan.band : null,
		samePipe: plan.samePipe
	};
}

type Ranked = Row & {
	position: number;
	change_note: string;
	method: string | null;
	title: string;
	parts_minor: number;
	currency: string;
	owner: string | null;
};

/**
 * Ranked rows with titles, owners, costs and reasons. Two queries at any data size and for any
 * number of results: the band counts, then the ranking with each result's details joined to it
 * (the ranked rows are a derived table with its own LIMIT, so only they are joined).
 */
export async function closeBuilds(
	target: Target,
	opts: { cycle: string; all?: boolean; limit: number; excludeBuild?: number }
) {
	const plan = await planClose(target, opts);
	const rows = await db().query<Ranked>(
		// A setup's cost is what was fitted up to it: the parts of its own and earlier setups.
		// Parts tied to no setup count only on the build's representative setup.
		`SELECT r.*, s.position, s.change_note, s.best_run_method AS method, b.title, b.currency, u.name AS owner,
			(SELECT COALESCE(SUM(p.cost_minor), 0) FROM parts p LEFT JOIN setups ps ON ps.id = p.setup_id
				WHERE p.build_id = s.build_id AND (ps.position <= s.position OR (p.setup_id IS NULL AND s.listed = 1))) AS parts_minor
		FROM (${plan.sql}) r
		JOIN setups s ON s.id = r.id JOIN builds b ON b.id = r.build_id LEFT JOIN users u ON u.id = b.owner_id
		ORDER BY r.score, r.id`,
		{ replacements: plan.replacements, type: QueryTypes.SELECT }
	);
	const results = rows.map((r) => {
		const c: Candidate = {
			cc: r.cc,
			exhaust: r.exhaust,
			carb: r.carb,
			finalDrive: r.fd,
			tyreMm: r.tyre,
			rollers: r.rollers,
			jet: r.jet,
			elevation: r.elev
		};
		return {
			setupId: r.id,
			buildId: r.build_id,
			title: r.title,
			owner: r.owner ?? 'a member',
			setup: `${r.position}. ${r.change_note}`,
			score: Number(r.score),
			reasons: reasons(target, c),
			bestKmh: r.best === null ? null : Number(r.best),
			method: r.method,
			partsMinor: Number(r.parts_minor),
			currency: r.currency,
			cc: r.cc
		};
	});
	return { results, bandCc: plan.band, candidates: rows.length };
}

/** "What would I get": the gearing ceiling beside what the closest builds measured. */
export function wouldGet(q: CloseQuery, target: Target, results: { bestKmh: number | null }[]) {
	const speeds = results
		.map((r) => r.bestKmh)
		.filter((x): x is number => x !== null)
		.sort((a, b) => a - b);
	const mid = speeds.length
		? speeds.length % 2
			? speeds[(speeds.length - 1) / 2]
			: (speeds[speeds.length / 2 - 1] + speeds[speeds.length / 2]) / 2
		: null;
	let gearingKmh: number | null = null;
	if (q.peak && q.topCvt && target.finalDrive && target.tyreMm) {
		gearingKmh = t.roadSpeedKmh(q.peak, q.topCvt * target.finalDrive, target.tyreMm);
	}
	return {
		gearingKmh,
		count: speeds.length,
		medianKmh: mid,
		minKmh: speeds[0] ?? null,
		maxKmh: speeds.at(-1) ?? null,
		fewClose: speeds.length < 5
	};
}
