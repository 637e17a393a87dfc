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
 * Plans the ranking of the published setups nearest to `target`, reading a bounded number of
 * index entries at any data size. The candidates are the setups nearest the target's displacement
 * (or, without one, its carburettor bore): from the target outwards in both directions over a
 * covering index, `BAND.perWalk` entries each way, once among setups with the target's pipe type
 * and once among all. They are scored on the stored derived columns and the best `limit` kept. A
 * denser community gives a narrower band around the target, never a longer read. Without either
 * to start from, the newest listed setups are ranked (`BAND.newest` of them).
 */
export async function planClose(
	target: Target,
	opts: {
		cycle: string;
		all?: boolean;
		limit: number;
		excludeBuild?: number;
		/** The benchmark's fair baseline turns the walks off: the same scoring over every setup. */
		prefilter?: boolean;
	}
) {
	const flag = opts.all ? 'any_listed' : 'listed';
	const repl: Record<string, unknown> = {
		cycle: opts.cycle,
		limit: opts.limit,
		cap: CAP,
		walk: BAND.perWalk,
		ties: BAND.ties,
		newest: BAND.newest
	};
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
	const lead =
		opts.prefilter === false
			? null
			: typeof target.cc === 'number'
				? 'cc'
				: typeof target.carb === 'number'
					? 'carb'
					: null;
	const suffix = opts.all ? '_all' : '';
	// Each walk reads the columns it scores from its own index entries (never the table rows). The
	// carburettor-led index carries the pipe type as close_pipe only.
	const select = (pipeCol: string) =>
		`SELECT s.id, s.build_id, s.displacement_cc AS cc, ${pipeCol} AS exhaust, s.carb_bore_mm AS carb,
			s.final_drive_ratio AS fd, s.tyre_circumference_mm AS tyre, s.roller_total_g AS rollers,
			s.sea_level_jet AS jet, s.best_run_elevation_m AS elev, s.best_run_kmh AS best,
			(${score.replaceAll('PIPE_COL', pipeCol)}) AS score`;
	const base = `s.${flag} = 1 AND s.engine_cycle = :cycle ${exclude}`;
	const walks: string[] = [];
	// A walk is found in two steps. First its boundary: the value of its `perWalk`-th entry from
	// the target (all boundaries in one query, index entries only). Then every entry between the
	// target and that boundary is read (`ties` at most): many setups share one displacement
	// (68.0 cc kits), and cutting through them in index order would choose among equals by the
	// index's next columns rather than by score. (MariaDB does not range over a subquery's value,
	// hence two statements.)
	const bounds: { sql: string; key: string }[] = [];
	const around = (index: string, where: string, col: string, centre: string, pipeCol: string) => {
		for (const [cmp, dir, edge, far] of [
			['>=', 'ASC', 'MAX', '<='],
			['<', 'DESC', 'MIN', '>=']
		]) {
			const cond = `${base} ${where} AND ${col} ${cmp} ${centre}`;
			const key = `b${bounds.length}`;
			bounds.push({
				key,
				sql: `(SELECT ${edge}(e.v) FROM (SELECT ${col} AS v FROM setups s FORCE INDEX (${index}) WHERE ${cond} ORDER BY ${col} ${dir} LIMIT :walk) e) AS ${key}`
			});
			walks.push(
				`(${select(pipeCol)} FROM setups s FORCE INDEX (${index}) WHERE ${cond} AND ${col} ${far} :${key} ORDER BY ${col} ${dir} LIMIT :ties)`
			);
		}
	};
	if (lead === 'cc') {
		if (target.exhaust)
			around(
				`setups_close${suffix}_by_exhaust`,
				'AND s.exhaust_type = :v_exhaust',
				's.displacement_cc',
				':v_cc',
				's.exhaust_type'
			);
		around(
			`setups_close${opts.all ? '_all' : '_representative'}`,
			'',
			's.displacement_cc',
			':v_cc',
			's.exhaust_type'
		);
	} else if (lead === 'carb') {
		// The bore index leads with the pipe type: one pair of walks per pipe type (the named one
		// gets its own walks either way).
		PIPES.forEach((pipe, k) => {
			repl[`pipe${k}`] = pipe;
			around(
				`setups_close${suffix}_by_carb`,
				`AND s.close_pipe = :pipe${k}`,
				's.carb_bore_mm',
				':v_carb',
				"NULLIF(s.close_pipe, '')"
			);
		});
	} else if (opts.prefilter === false) {
		walks.push(`(${select('s.exhaust_type')} FROM setups s WHERE ${base})`);
	} else {
		walks.push(
			`(${select('s.exhaust_type')} FROM setups s FORCE INDEX (PRIMARY) WHERE ${base} ORDER BY s.id DESC LIMIT :newest)`
		);
	}
	let reach: number | null = null;
	if (bounds.length) {
		const [row] = await db().query<Record<string, number | null>>(
			`SELECT ${bounds.map((b) => b.sql).join(', ')}`,
			{ replacements: repl, type: QueryTypes.SELECT }
		);
		for (const b of bounds) {
			const v = row[b.key];
			repl[b.key] = v === null ? null : Number(v);
			// How far the candidates reach from the target's displacement ("within ± … cc").
			if (lead === 'cc' && v !== null)
				reach = Math.max(reach ?? 0, Math.abs(Number(v) - (target.cc as number)));
		}
	}
	// The same setup may come from two walks (its own pipe type, and all of them): once each.
	const sql = `SELECT c.* FROM (${walks.join(' UNION ')}) c ORDER BY c.score, c.id DESC LIMIT :limit`;
	return { sql, replacements: repl, lead, reach };
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
 * number of results: the walks' boundaries, then the ranking with each result's details joined
 * to it (the ranked rows are a derived table with its own LIMIT, so only they are joined).
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
		ORDER BY r.score, r.id DESC`,
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
	// Rounded up to the tenth of a cc the page shows.
	const bandCc = plan.reach === null ? null : Math.ceil(plan.reach * 10) / 10;
	return { results, bandCc, comparedBy: plan.lead ?? ('newest' as const), candidates: rows.length };
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
