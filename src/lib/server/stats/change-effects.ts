import { QueryTypes } from 'sequelize';
import { CHANGE_KINDS, judgeStep, type ChangeKind } from '../../sheet/change-kinds';
import { db } from '../db/connection';
import { models } from '../db/models';
import { stepRun } from '../sheets/recompute';

// What each kind of change did across the published sheets. Pairs are judged when a sheet is saved
// (src/lib/sheet/change-kinds.ts; stored as setups.change_kind and setups.effect_kmh), so these are
// scans of one covering index; the median and quartiles are MariaDB's PERCENTILE_CONT (linear
// interpolation between the two nearest ranks).

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
	const [stats, left] = await Promise.all([
		db().query<{ kind: string; n: number; median: number; q1: number; q3: number }>(
			`SELECT DISTINCT change_kind AS kind,
				COUNT(*) OVER (PARTITION BY change_kind) AS n,
				PERCENTILE_CONT(0.5) WITHIN GROUP (ORDER BY effect_kmh) OVER (PARTITION BY change_kind) AS median,
				PERCENTILE_CONT(0.25) WITHIN GROUP (ORDER BY effect_kmh) OVER (PARTITION BY change_kind) AS q1,
				PERCENTILE_CONT(0.75) WITHIN GROUP (ORDER BY effect_kmh) OVER (PARTITION BY change_kind) AS q3
			FROM setups FORCE INDEX (setups_change_effects)
			WHERE any_listed = 1 AND change_kind IN (:kinds) AND effect_kmh IS NOT NULL`,
			{ replacements: { kinds: CHANGE_KINDS.map((k) => k.kind) }, type: QueryTypes.SELECT }
		),
		// Single-kind steps that were left out (method or air), to say how many and why on the page.
		db().query<{ kind: string; n: number }>(
			`SELECT change_kind AS kind, COUNT(*) AS n FROM setups FORCE INDEX (setups_change_effects)
			WHERE any_listed = 1 AND change_kind IN (:kinds) AND effect_kmh IS NULL GROUP BY change_kind`,
			{ replacements: { kinds: CHANGE_KINDS.map((k) => k.kind) }, type: QueryTypes.SELECT }
		)
	]);
	const byKind = new Map(stats.map((s) => [s.kind, s]));
	const leftOut = new Map(left.map((s) => [s.kind, Number(s.n)]));
	const num = (v: number | undefined) => (v === undefined || v === null ? null : Number(v));
	return CHANGE_KINDS.map(({ kind, label }) => {
		const s = byKind.get(kind);
		return {
			kind,
			label,
			pairs: s ? Number(s.n) : 0,
			excluded: leftOut.get(kind) ?? 0,
			medianKmh: num(s?.median),
			q1Kmh: num(s?.q1),
			q3Kmh: num(s?.q3)
		};
	});
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
		ORDER BY s.effect_kmh DESC, s.id LIMIT :limit OFFSET :offset`,
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

/** A build's own steps, judged by the same rules (for its page). */
export async function stepsOf(buildId: number) {
	const list = await models().Setup.findAll({
		where: { buildId },
		order: [['position', 'ASC']],
		attributes: [
			'id',
			'position',
			'changeNote',
			'changeKind',
			'bestRunKmh',
			'bestRunMethod',
			'bestRunDensity'
		]
	});
	return list.slice(1).map((s, i) => {
		const prev = list[i];
		const verdict = judgeStep((s.changeKind ?? 'mixed') as never, stepRun(prev), stepRun(s));
		return { from: prev.position, to: s.position, changeNote: s.changeNote, ...verdict };
	});
}
