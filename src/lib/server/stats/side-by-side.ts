import { Op } from 'sequelize';
import { roleAllows } from '../../roles';
import { formatMoney } from '../../sheet/format';
import { BUILD_SHOWN, type Column } from '../../sheet/side-by-side';
import { models } from '../db/models';

type Reader = { id: string; role: Parameters<typeof roleAllows>[0] } | null;
export type Pick = { builds: number[] } | { setups: number[] };

/**
 * The columns for side by side: a build stands for its latest measured setup (its latest setup when
 * none has a run). Four queries whatever is picked. Builds the reader may not see are left out and
 * counted, so a shared link to a since-hidden build degrades gracefully.
 */
export async function loadColumns(pick: Pick, me: Reader) {
	const { Build, Setup, Run, User } = models();
	const setupIds = 'setups' in pick ? pick.setups : [];
	const chosen =
		'setups' in pick
			? await Setup.findAll({ where: { id: { [Op.in]: setupIds } } })
			: await Setup.findAll({
					where: { buildId: { [Op.in]: pick.builds } },
					order: [['position', 'ASC']]
				});
	const buildIds = [...new Set(chosen.map((s) => s.buildId))];
	const [builds, runs] = await Promise.all([
		Build.findAll({
			where: { id: { [Op.in]: buildIds } },
			include: [{ model: User, as: 'owner', attributes: ['name'] }]
		}),
		Run.findAll({
			where: {
				id: { [Op.in]: chosen.map((s) => s.bestRunId).filter((x): x is number => x !== null) }
			}
		})
	]);
	const byBuild = new Map(builds.map((b) => [b.id, b]));
	const runById = new Map(runs.map((r) => [r.id, r]));
	const seesTakenDown = (b: { ownerId: string | null }) =>
		Boolean(me && (me.id === b.ownerId || roleAllows(me.role, 'moderator')));
	const visible = (id: number) => {
		const b = byBuild.get(id);
		if (!b) return false;
		if (b.publication === 'published' && b.moderation === 'visible') return true;
		return Boolean(me && (me.id === b.ownerId || roleAllows(me.role, 'admin')));
	};
	// In the order asked for: setups as listed, builds as listed (each by its representative setup).
	const order =
		'setups' in pick
			? setupIds.map((id) => chosen.find((s) => s.id === id)).filter((s) => s !== undefined)
			: pick.builds
					.map((id) => {
						const mine = chosen.filter((s) => s.buildId === id);
						return mine.filter((s) => s.bestRunKmh !== null).at(-1) ?? mine.at(-1);
					})
					.filter((s) => s !== undefined);
	const columns: Column[] = [];
	for (const s of order) {
		if (!visible(s.buildId)) continue;
		// A setup the desk took down is left out for everyone but its owner and the staff.
		if (s.moderation === 'hidden' && !seesTakenDown(byBuild.get(s.buildId)!)) continue;
		const b = byBuild.get(s.buildId)!;
		const r = s.bestRunId ? runById.get(s.bestRunId) : undefined;
		columns.push({
			buildId: b.id,
			setupId: s.id,
			title: b.title,
			owner: b.owner?.name ?? 'a member',
			position: s.position,
			changeNote: s.changeNote,
			build: Object.fromEntries(BUILD_SHOWN.map((k) => [k, b.get(k as never)])),
			config: s.config,
			best: r
				? {
						kmh: r.speedKmh,
						method: r.method,
						twoWay: r.twoWay,
						venue: r.venue,
						elevationM: r.elevationM,
						airDensity: r.airDensity
					}
				: null,
			partsTotal: formatMoney(b.partsTotalMinor, b.currency)
		});
	}
	const asked = 'setups' in pick ? pick.setups.length : pick.builds.length;
	return { columns, missing: asked - columns.length };
}
