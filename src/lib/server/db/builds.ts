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
export async function listPublished(f: ListFilters) {
	const { Build, User, Setup } = models();
	const where: WhereOptions<Build> = { publication: 'published', moderation: 'visible' };
	if (f.cycle) Object.assign(where, { engineCycle: f.cycle });
	if (f.withRuns) Object.assign(where, { runCount: { [Op.gt]: 0 } });
	if (f.q) Object.assign(where, { title: { [Op.like]: `%${f.q.replace(/[%_\\]/g, '\\$&')}%` } });
	const include = [{ model: User, as: 'owner', attributes: ['name'] }];
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
	const page = Math.max(1, f.page ?? 1);
	const { rows, count } = await Build.findAndCountAll({
		where,
		include,
		order: [
			['publishedAt', 'DESC'],
			['id', 'DESC']
		],
		limit: PAGE_SIZE,
		offset: (page - 1) * PAGE_SIZE
	});
	return { rows, count, page, pages: Math.max(1, Math.ceil(count / PAGE_SIZE)) };
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
