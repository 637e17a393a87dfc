import { refreshWords } from './search-words';
import { refreshSummaries } from './stat-summaries';
import { Op, QueryTypes } from 'sequelize';
import { deriveRun, deriveSetup } from '../../sheet/derive';
import { changeKind, judgeStep, type StepRun } from '../../sheet/change-kinds';
import { models } from '../db/models';

const same = (a: number | null, b: number | null) =>
	a === null ? b === null : b !== null && Math.abs(a - b) < 1e-9;

/**
 * Rewrites a setup's derived columns (and its runs' air values) from its configuration. Called
 * after every save of a setup or a run, so the columns later queries rank on never go stale.
 */
export async function recomputeSetup(setupId: number): Promise<void> {
	const { Setup, Run } = models();
	const s = await Setup.findByPk(setupId);
	if (!s) return;
	const c = s.config;
	const d = deriveSetup(c);
	const runs = await Run.findAll({ where: { setupId } });
	let best: (typeof runs)[number] | null = null;
	let bestJet: number | null = null;
	let bestDensity: number | null = null;
	for (const r of runs) {
		const air = deriveRun(r, c);
		if (
			!same(air.airDensity, r.airDensity) ||
			!same(air.seaLevelJet, r.seaLevelJet) ||
			!same(air.densityAltitudeM, r.densityAltitudeM)
		) {
			await Run.update(air, { where: { id: r.id } });
		}
		if (!best || r.speedKmh > best.speedKmh) {
			best = r;
			bestJet = air.seaLevelJet;
			bestDensity = air.airDensity;
		}
	}
	await Setup.update(
		{
			exhaustType: typeof c.exhaustType === 'string' ? c.exhaustType : null,
			displacementCc: d.displacementCc,
			carbBoreMm: typeof c.carbBore === 'number' ? c.carbBore : null,
			mainJet: typeof c.mainJet === 'number' ? c.mainJet : null,
			finalDriveRatio: d.finalDriveRatio,
			overallRatio: d.overallRatio,
			tyreCircumferenceMm: d.tyreCircumferenceMm,
			rollerTotalG: d.rollerTotalG,
			gearingLimitKmh: d.gearingLimitKmh,
			bestRunKmh: best?.speedKmh ?? null,
			bestRunId: best?.id ?? null,
			bestRunElevationM: best?.elevationM ?? null,
			bestRunMethod: best?.method ?? null,
			bestRunDensity: bestDensity,
			bestRunTwoWay: best ? best.twoWay : null,
			bestRunVenue: best?.venue ?? null,
			seaLevelJet: bestJet
		},
		{ where: { id: setupId } }
	);
}

/** Counts, parts total, best and stock-baseline speeds for the build list and the bench. */
export async function recomputeBuild(buildId: number): Promise<void> {
	const { Build } = models();
	const [row] = await Build.sequelize!.query<{
		setups: number;
		runs: number;
		parts: number | null;
		names: string | null;
		best: number | null;
		stock: number | null;
	}>(
		`SELECT
			(SELECT COUNT(*) FROM setups WHERE build_id = :id) AS setups,
			(SELECT COUNT(*) FROM runs WHERE build_id = :id) AS runs,
			(SELECT SUM(cost_minor) FROM parts WHERE build_id = :id) AS parts,
			(SELECT GROUP_CONCAT(name ORDER BY id SEPARATOR ' · ') FROM parts WHERE build_id = :id) AS names,
			(SELECT MAX(speed_kmh) FROM runs WHERE build_id = :id) AS best,
			(SELECT s.best_run_kmh FROM setups s WHERE s.build_id = :id AND s.is_stock = 1 ORDER BY s.position LIMIT 1) AS stock`,
		{ replacements: { id: buildId }, type: QueryTypes.SELECT }
	);
	await Build.update(
		{
			setupCount: Number(row.setups),
			runCount: Number(row.runs),
			partsTotalMinor: Number(row.parts ?? 0),
			// Searched together with the title and story (one FULLTEXT index on builds).
			partsText: row.names ?? '',
			bestSpeedKmh: row.best === null ? null : Number(row.best),
			stockSpeedKmh: row.stock === null ? null : Number(row.stock)
		},
		{ where: { id: buildId }, silent: true }
	);
	await refreshListing(buildId);
}

/** Which of a build's setups the close-builds ranking may return (see the migration's note). */
export async function refreshListing(buildId: number): Promise<void> {
	const { Build, Setup } = models();
	const b = await Build.findByPk(buildId);
	if (!b) return;
	const open = b.publication === 'published' && b.moderation === 'visible';
	const rep = await Setup.findOne({
		where: { buildId, bestRunKmh: { [Op.ne]: null }, moderation: 'visible' },
		attributes: ['id', 'exhaustType', 'displacementCc', 'bestRunElevationM'],
		order: [['position', 'DESC']]
	});
	// The builds list filters on these (see db/build-list.ts).
	await Build.update(
		{
			repPipe: rep?.exhaustType ?? '',
			repCc: rep?.displacementCc ?? null,
			repElevationM: rep?.bestRunElevationM ?? null
		},
		{ where: { id: buildId }, silent: true }
	);
	// One statement for all of the build's setups.
	await Setup.sequelize!.query(
		"UPDATE setups SET engine_cycle = :cycle, engine_family = :family, listed = (:open AND id = :rep), any_listed = (:open AND best_run_kmh IS NOT NULL AND moderation = 'visible') WHERE build_id = :buildId",
		{
			replacements: {
				cycle: b.engineCycle,
				family: b.engineFamily ?? '',
				open: open ? 1 : 0,
				rep: rep?.id ?? 0,
				buildId
			}
		}
	);
	await refreshWords({ ...b.get({ plain: true }), open });
	await refreshSteps(buildId);
	await refreshSummaries(buildId);
}

/**
 * Each setup's step from the one before: which setup that is, the kind of change, and the speed
 * change when the pair passes the change-effects rules. Rewritten for the whole build, since saving
 * or deleting one setup changes its successor's step too; only rows that differ are written.
 */
export async function refreshSteps(buildId: number): Promise<void> {
	const { Setup } = models();
	const list = await Setup.findAll({ where: { buildId }, order: [['position', 'ASC']] });
	for (let i = 0; i < list.length; i++) {
		const s = list[i];
		const prev = i > 0 ? list[i - 1] : null;
		let kind: string | null = null;
		let effect: number | null = null;
		if (prev) {
			const k = changeKind(prev.config, s.config);
			const v = judgeStep(k, stepRun(prev), stepRun(s));
			kind = k;
			effect = v.counts ? v.deltaKmh : null;
		}
		if (s.prevSetupId !== (prev?.id ?? null) || s.changeKind !== kind || !same(s.effectKmh, effect))
			await Setup.update(
				{ prevSetupId: prev?.id ?? null, changeKind: kind, effectKmh: effect },
				{ where: { id: s.id }, silent: true }
			);
	}
}

export const stepRun = (s: {
	bestRunKmh: number | null;
	bestRunMethod: string | null;
	bestRunDensity: number | null;
}): StepRun =>
	s.bestRunKmh === null
		? null
		: { kmh: s.bestRunKmh, method: s.bestRunMethod ?? '', density: s.bestRunDensity };
