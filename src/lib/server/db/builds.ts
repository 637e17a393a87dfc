import { Op, type WhereOptions } from 'sequelize';
import { models, type Build } from './models';

export type BuildPatch = Partial<
	Pick<
		Build,
		| 'title'
		| 'story'
		| 'chassis'
		| 'engineFamily'
		| 'engineCycle'
		| 'cooling'
		| 'cylinderOrientation'
		| 'brakeFront'
		| 'brakeRear'
		| 'brakesUpgraded'
		| 'currency'
	>
>;

export async function read(id: number) {
	return Number.isInteger(id) && id > 0 ? models().Build.findByPk(id) : null;
}

export async function create(ownerId: string, patch: BuildPatch & { title: string }) {
	return models().Build.create({ ...patch, ownerId });
}

/** Saves only if nobody saved since `version`; false means someone did (a conflict). */
export async function update(
	id: number,
	version: number,
	patch: BuildPatch | Partial<Build>
): Promise<boolean> {
	const [n] = await models().Build.update(
		{ ...patch, version: version + 1 },
		{ where: { id, version } }
	);
	return n === 1;
}

export async function destroy(id: number) {
	await models().Build.destroy({ where: { id } });
}

export type ListFilters = {
	cycle?: string;
	exhaust?: string;
	withRuns?: boolean;
	q?: string;
	page?: number;
};
export const PAGE_SIZE = 24;

/** Published, visible builds for the public list, newest first. */
async function listWhere(f: Omit<ListFilters, 'page'>): Promise<WhereOptions<Build>> {
	const { Setup } = models();
	const where: WhereOptions<Build> = { publication: 'published', moderation: 'visible' };
	if (f.cycle) Object.assign(where, { engineCycle: f.cycle });
	if (f.withRuns) Object.assign(where, { runCount: { [Op.gt]: 0 } });
	if (f.q) Object.assign(where, { title: { [Op.like]: `%${f.q.replace(/[%_\\]/g, '\\$&')}%` } });
	if (f.exhaust) {
		// Filter by the exhaust of the build's latest setup, via a subquery on the indexed column.
		Object.assign(where, {
			id: {
				[Op.in]: Setup.sequelize!.literal(
					`(SELECT s.build_id FROM setups s WHERE s.exhaust_type = ${Setup.sequelize!.escape(f.exhaust)} AND s.position = (SELECT MAX(s2.position) FROM setups s2 WHERE s2.build_id = s.build_id))`
				)
			}
		});
	}
	return where;
}

/** A member's own builds: drafts first, then the rest by last change. */
export async function listBench(ownerId: string) {
	return models().Build.findAll({
		where: { ownerId },
		order: [
			['publication', 'ASC'],
			['updatedAt', 'DESC']
		]
	});
}

export type CursorFilters = Omit<ListFilters, 'page'> & {
	sort: 'newest' | 'fastest';
	cursor?: string;
	limit: number;
};

/** Keyset pagination: the cursor carries the last row's sort key and id, so pages never overlap. */
export async function listCursor(f: CursorFilters) {
	const { Build, User } = models();
	const base = await listWhere(f);
	let after: WhereOptions<Build> = {};
	if (f.cursor) {
		const [k, id] = Buffer.from(f.cursor, 'base64url').toString().split(':');
		const key = Number(k);
		const lastId = Number(id);
		if (Number.isFinite(key) && Number.isInteger(lastId)) {
			// MariaDB sorts NULL speeds last in DESC order; -1 in the cursor stands for NULL.
			if (f.sort === 'newest') after = { id: { [Op.lt]: lastId } };
			else if (key === -1) after = { bestSpeedKmh: null, id: { [Op.lt]: lastId } };
			else
				after = {
					[Op.or]: [
						{ bestSpeedKmh: { [Op.lt]: key } },
						{ bestSpeedKmh: key, id: { [Op.lt]: lastId } },
						{ bestSpeedKmh: null }
					]
				};
		}
	}
	const order: [string, string][] =
		f.sort === 'fastest'
			? [
					['bestSpeedKmh', 'DESC'],
					['id', 'DESC']
				]
			: [['id', 'DESC']];
	const rows = await Build.findAll({
		where: { [Op.and]: [base, after] },
		include: [{ model: User, as: 'owner', attributes: ['name'] }],
		order,
		limit: f.limit + 1
	});
	const more = rows.length > f.limit;
	const page = rows.slice(0, f.limit);
	const last = page.at(-1);
	const next =
		more && last
			? Buffer.from(
					`${f.sort === 'fastest' ? (last.bestSpeedKmh ?? -1) : last.id}:${last.id}`
				).toString('base64url')
			: null;
	return {
		builds: page.map((b) => ({
			id: b.id,
			title: b.title,
			owner: b.owner?.name ?? 'a member',
			engineFamily: b.engineFamily,
			bestSpeedKmh: b.bestSpeedKmh,
			stockSpeedKmh: b.stockSpeedKmh,
			partsTotalMinor: b.partsTotalMinor,
			currency: b.currency,
			setupCount: b.setupCount,
			runCount: b.runCount
		})),
		next
	};
}
