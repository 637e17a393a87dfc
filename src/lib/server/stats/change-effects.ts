import { QueryTypes } from 'sequelize';
import { CHANGE_KINDS, changeKind, judgeStep, type ChangeKind } from '../../sheet/change-kinds';
import { db } from '../db/connection';
import { whileUnchanged } from './kept';
import { models } from '../db/models';
import { stepRun } from '../derived/recompute';

// What each kind of change did across the published sheets. Pairs are judged when a sheet is saved
// (src/lib/sheet/change-kinds.ts; stored as setups.change_kind and setups.effect_kmh): the figures
// are read from counts kept with them, a kind's pairs from one covering index sorted by speed change.

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
	// From the counts kept on every write (src/lib/stats/summary-sql.ts): per kind, the pairs left
	// out, and the pairs at each speed change per whole km/h (to find a rank) and per hundredth (the
	// precision steps are stored at, so the values read are exact).
	const rows = await db().query<{ kind: string; grain: number; v: number; n: number }>(
		'SELECT kind, grain, v, n FROM effect_counts WHERE grain IN (0, 2) AND n > 0 ORDER BY kind, grain, v',
		{ type: QueryTypes.SELECT }
	);
	const leftOut = new Map<string, number>();
	const buckets = new Map<string, { v: number; n: number }[]>();
	for (const r of rows) {
		if (Number(r.grain) === 0) leftOut.set(r.kind, Number(r.n));
		else buckets.set(r.kind, [...(buckets.get(r.kind) ?? []), { v: Number(r.v), n: Number(r.n) }]);
	}
	const n = new Map([...buckets].map(([kind, list]) => [kind, list.reduce((t, b) => t + b.n, 0)]));
	// Quartiles by linear interpolation between order statistics (R-7, as PERCENTILE_CONT and most
	// statistics packages do): h = (n − 1)·p, between the values at ranks ⌊h⌋ and ⌊h⌋ + 1.
	const wanted: { kind: string; p: number; lo: number; h: number }[] = [];
	for (const [kind, m] of n)
		for (const p of [0.25, 0.5, 0.75]) {
			const h = (m - 1) * p;
			wanted.push({ kind, p, lo: Math.floor(h), h });
		}
	// Which whole-km/h bucket holds each rank, and how far into it.
	const place = (kind: string, rank: number) => {
		let before = 0;
		for (const b of buckets.get(kind)!) {
			if (rank < before + b.n) return { bucket: b.v, within: rank - before };
			before += b.n;
		}
		throw new Error(`rank ${rank} is past the ${kind} pairs`);
	};
	const needed = new Map<string, { kind: string; bucket: number }>();
	const at = wanted.map((w) => {
		const m = n.get(w.kind)!;
		const pair = [place(w.kind, w.lo), place(w.kind, Math.min(w.lo + 1, m - 1))];
		for (const p of pair) needed.set(`${w.kind}:${p.bucket}`, { kind: w.kind, bucket: p.bucket });
		return pair;
	});
	// Then the hundredths inside only those buckets (at most six a kind, each ≤ 100 rows).
	const repl: Record<string, unknown> = {};
	const ranges = [...needed.values()].map((x, i) => {
		Object.assign(repl, {
			[`k${i}`]: x.kind,
			[`a${i}`]: x.bucket * 100,
			[`b${i}`]: x.bucket * 100 + 99
		});
		return `(kind = :k${i} AND v BETWEEN :a${i} AND :b${i})`;
	});
	const fine = ranges.length
		? await db().query<{ kind: string; v: number; n: number }>(
				`SELECT kind, v, n FROM effect_counts WHERE grain = 1 AND n > 0 AND (${ranges.join(' OR ')}) ORDER BY kind, v`,
				{ replacements: repl, type: QueryTypes.SELECT }
			)
		: [];
	const inBucket = new Map<string, { v: number; n: number }[]>();
	for (const r of fine) {
		const key = `${r.kind}:${Math.floor(Number(r.v) / 100)}`;
		inBucket.set(key, [...(inBucket.get(key) ?? []), { v: Number(r.v), n: Number(r.n) }]);
	}
	const valueAt = (kind: string, p: { bucket: number; within: number }) => {
		let before = 0;
		for (const r of inBucket.get(`${kind}:${p.bucket}`) ?? []) {
			if (p.within < before + r.n) return r.v / 100;
			before += r.n;
		}
		throw new Error(`the ${kind} counts per km/h and per hundredth disagree`);
	};
	const q = new Map<string, number>();
	wanted.forEach((w, i) => {
		const low = valueAt(w.kind, at[i][0]);
		const high = valueAt(w.kind, at[i][1]);
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

/**
 * The pairs behind one kind's figures, largest gain first (one query, a page at a time). Ties go
 * in the index's own order (build, then setup), so a page is read off the index, not sorted.
 */
export async function pairsFor(kind: ChangeKind, limit = 50, offset = 0): Promise<Pair[]> {
	const rows = await db().query<Record<string, unknown>>(
		`SELECT s.build_id, b.title, s.position, s.change_note, p.best_run_kmh AS before_kmh,
			s.best_run_kmh AS after_kmh, s.effect_kmh, s.best_run_method AS method
		FROM setups s FORCE INDEX (setups_change_effects)
		JOIN setups p ON p.id = s.prev_setup_id JOIN builds b ON b.id = s.build_id
		WHERE s.any_listed = 1 AND s.change_kind = :kind AND s.effect_kmh IS NOT NULL
		ORDER BY s.effect_kmh DESC, s.build_id DESC, s.id DESC LIMIT :limit OFFSET :offset`,
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

/** Change effects as pages and the API show them (every kind, one kind's first pairs), kept while no published sheet changes (kept.ts). */
export function changeEffectsKept(kind: ChangeKind | null) {
	return whileUnchanged(`change-effects ${kind}`, async () => {
		const [kinds, pairs] = await Promise.all([summarise(), kind ? pairsFor(kind) : null]);
		return { kinds, pairs };
	});
}
