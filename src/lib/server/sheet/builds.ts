import { literal } from 'sequelize';
import { models, type Build } from '../db/models';

export type BuildPatch = Partial<
	Pick<
		Build,
		| 'title'
		| 'story'
		| 'chassis'
		| 'engineFamily'
		| 'baseScooterId'
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

/** A member's own builds: drafts first, then the rest by last change. */
/** The member's own builds, each with its latest setup (where "Add a run" goes). */
export async function listBench(ownerId: string) {
	return models().Build.findAll({
		where: { ownerId },
		attributes: {
			include: [
				[
					literal(
						'(SELECT s.id FROM setups s WHERE s.build_id = `Build`.`id` ORDER BY s.position DESC LIMIT 1)'
					),
					'lastSetupId'
				]
			]
		},
		order: [
			['publication', 'ASC'],
			['updatedAt', 'DESC']
		]
	});
}
