import { QueryTypes } from 'sequelize';
import { CHANGE_KINDS, changeKind, judgeStep, type ChangeKind } from '../../sheet/change-kinds';
import { db } from '../db/connection';
import { models } from '../db/models';
import { stepRun } from '../derived/recompute';

// What each kind of change did across the published sheets. Pairs are judged when a sheet is saved
// (src/lib/sheet/change-kinds.ts; stored as setups.change_kind and setups.effect_kmh), so these are
// reads of one covering index, sorted by kind and speed change.

export type KindSummary = {
	kind: ChangeKind;
	label: string;
	pairs: number;
	excluded: number;
	medianKmh: number | null;
	q1Kmh: number | null;
	q3Kmh: number | null;
};

export async function summarise(): Promise<KindSummary[]> {
	const kinds = CHANGE_KINDS.map((k) => k.kind);
	const counts = await db().query<{ kind: string; n: number; left_out: number }>(
		`SELECT change_kind AS kind, SUM(effect_kmh IS NOT NULL) AS n, SUM(effect_kmh IS NULL) AS left_out
		FROM setups FORCE INDEX (setups_change_effects)
		WHERE any_listed = 1 AND change_kind IN (:kinds) GROUP BY change_kind`,
		{ replacements: { kinds }, type: QueryTypes.SELECT }
	);
	const n = new Map(counts.map((c) => [c.kind, Number(c.n)]));
	const leftOut = new Map(counts.map((c) => [c.kind, Number(c.left_out)]));
	// Quartiles by linear interpolation between order statistics (R-7, as PERCENTILE_CONT and most
	// statistics packages do): h = (n − 1)·p, between the values at ranks ⌊h⌋ and ⌊h⌋ + 1. The index
	// keeps each kind's speed changes sorted, so each pair of ranks is read at its offset — from the
	// nearer end — in one statement for all kinds.
	const wanted: { kind: string; p: number; lo: number; h: number }[] = [];
	for (const kind of kinds) {
		const m = n.get(kind) ?? 0;
		if (m === 0) continue;
		for (const p of [0.25, 0.5, 0.75]) {
			const h = (m - 1) * p;
			wanted.push({ kind, p, lo: Math.floor(h), h });
		}
	}
	const repl: Record<string, unknown> = {};
	const parts = wanted.map((w, i) => {
		const m = n.get(w.kind)!;
		const fromTop = w.lo > m / 2;
		repl[`k${i}`] = w.kind;
		// Ranks ⌊h⌋ and ⌊h⌋ + 1 counted from the bottom, or the same two from the top (m − 2 − ⌊h⌋ ≥ 0,
		// since ⌊h⌋ ≤ 0.75·(m − 1) < m − 1 whenever the top is nearer).
		const offset = fromTop ? m - 2 - w.lo : w.lo;
		return `(SELECT ${i} AS i, effect_kmh AS v FROM setups FORCE INDEX (setups_change_effects)
			WHERE any_listed = 1 AND change_kind = :k${i} AND effect_kmh IS NOT NULL
			ORDER BY effect_kmh ${fromTop ? 'DESC' : 'ASC'} LIMIT 2 OFFSET ${offset})`;
	});
	const ranks = parts.length
		? await db().query<{ i: number; v: number }>(parts.join(' UNION ALL '), {
				replacements: repl,
				type: QueryTypes.SELECT
			})
		: [];
	const values = new Map<number, number[]>();
	for (const r of ranks) values.set(Number(r.i), [...(values.get(Number(r.i)) ?? []), Number(r.v)]);
	const q = new Map<string, number>();
	wanted.forEach((w, i) => {
		// One value only when the kind has a single pair.
		const [low, high = low] = (values.get(i) ?? []).sort((x, y) => x - y);
		q.set(`${w.kind}:${w.p}`, low + (w.h - w.lo) * (high - low));
	});
	const get = (kind: string, p: number) => q.get(`${kind}:${p}`) ?? null;
	return CHANGE_KINDS.map(({ kind, label }) => ({
		kind,
		label,
		pairs: n.get(kind) ?? 0,
		excluded: leftOut.get(kind) ?? 0,
		medianKmh: get(kind, 0.5),
		q1Kmh: get(kind, 0.25),
		q3Kmh: get(kind, 0.75)
	}));
}

export type Pair = {
	buildId: number;
	title: string;
	position: number;
	changeNote: string;
	beforeKmh: number;
	afterKmh: number;
	deltaKmh: number;
	method: string;
};

/** The pairs behind one kind's figures, largest gain first (one query, a page at a time). */
export async function pairsFor(kind: ChangeKind, limit = 50, offset = 0): Promise<Pair[]> {
	const rows = await db().query<Record<string, unknown>>(
		`SELECT s.build_id, b.title, s.position, s.change_note, p.best_run_kmh AS before_kmh,
			s.best_run_kmh AS after_kmh, s.effect_kmh, s.best_run_method AS method
		FROM setups s FORCE INDEX (setups_change_effects)
		JOIN setups p ON p.id = s.prev_setup_id JOIN builds b ON b.id = s.build_id
		WHERE s.any_listed = 1 AND s.change_kind = :kind AND s.effect_kmh IS NOT NULL
		ORDER BY s.effect_kmh DESC, s.id DESC LIMIT :limit OFFSET :offset`,
		{ replacements: { kind, limit, offset }, type: QueryTypes.SELECT }
	);
	return rows.map((r) => ({
		buildId: Number(r.build_id),
		title: String(r.title),
		position: Number(r.position),
		changeNote: String(r.change_note),
		beforeKmh: Number(r.before_kmh),
		afterKmh: Number(r.after_kmh),
		deltaKmh: Number(r.effect_kmh),
		method: String(r.method)
	}));
}

/** A build's own steps, judged by the same functions that fill the stored columns (for its page). */
export async function stepsOf(buildId: number) {
	const list = await models().Setup.findAll({
		where: { buildId },
		order: [['position', 'ASC']],
		attributes: [
			'id',
			'position',
			'changeNote',
			'config',
			'bestRunKmh',
			'bestRunMethod',
			'bestRunDensity'
		]
	});
	return stepsFrom(list);
}

type StepSetup = Parameters<typeof stepRun>[0] & {
	position: number;
	changeNote: string;
	config: Parameters<typeof changeKind>[0];
};

/** What each step of a sheet did, from its setups in order (the build page reads them once). */
export function stepsFrom(list: StepSetup[]) {
	return list.slice(1).map((s, i) => {
		const prev = list[i];
		const kind = changeKind(prev.config, s.config);
		const verdict = judgeStep(kind, stepRun(prev), stepRun(s));
		return { from: prev.position, to: s.position, changeNote: s.changeNote, ...verdict };
	});
}

export type RecentStep = Pair & { kind: string };

/**
 * The newest steps that count in change effects, for the home page: one query walking the setups
 * newest first, stopping once it has enough (counted steps are common, so it reads few rows).
 */
export async function newestSteps(limit = 6): Promise<RecentStep[]> {
	const rows = await db().query<Record<string, unknown>>(
		// STRAIGHT_JOIN: walk the setups newest first and stop after `limit`. Left to itself, MariaDB
		// read every build and sorted (500 ms a home page at 100,000 builds).
		`SELECT STRAIGHT_JOIN s.build_id, b.title, s.position, s.change_note, s.change_kind, p.best_run_kmh AS before_kmh,
			s.best_run_kmh AS after_kmh, s.effect_kmh, s.best_run_method AS method
		FROM setups s FORCE INDEX (PRIMARY) JOIN setups p ON p.id = s.prev_setup_id JOIN builds b ON b.id = s.build_id
		WHERE s.any_listed = 1 AND s.effect_kmh IS NOT NULL
		ORDER BY s.id DESC LIMIT :limit`,
		{ replacements: { limit }, type: QueryTypes.SELECT }
	);
	return rows.map((r) => ({
		buildId: Number(r.build_id),
		title: String(r.title),
		position: Number(r.position),
		changeNote: String(r.change_note),
		kind: String(r.change_kind),
		beforeKmh: Number(r.before_kmh),
		afterKmh: Number(r.after_kmh),
		deltaKmh: Number(r.effect_kmh),
		method: String(r.method)
	}));
}
