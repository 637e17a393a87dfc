import { models, type Run } from '../db/models';

export type RunValues = Omit<
	Run['_creationAttributes'],
	| 'id'
	| 'setupId'
	| 'buildId'
	| 'createdAt'
	| 'updatedAt'
	| 'version'
	| 'airDensity'
	| 'densityAltitudeM'
	| 'seaLevelJet'
>;

export async function listForBuild(buildId: number) {
	return models().Run.findAll({
		where: { buildId },
		order: [
			['runOn', 'ASC'],
			['id', 'ASC']
		]
	});
}

/** The build's most recent run (by its date, then the order logged), or null. */
export async function latestForBuild(buildId: number) {
	return models().Run.findOne({
		where: { buildId },
		order: [
			['runOn', 'DESC'],
			['id', 'DESC']
		]
	});
}

export async function read(buildId: number, id: number) {
	return Number.isInteger(id) ? models().Run.findOne({ where: { id, buildId } }) : null;
}

export async function create(buildId: number, setupId: number, v: RunValues) {
	return models().Run.create({ ...v, buildId, setupId });
}

export async function update(id: number, version: number, v: Partial<RunValues>) {
	const [n] = await models().Run.update({ ...v, version: version + 1 }, { where: { id, version } });
	return n === 1;
}

export async function destroy(id: number) {
	await models().Run.destroy({ where: { id } });
}
