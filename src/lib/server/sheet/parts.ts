import { models } from '../db/models';

export async function listForBuild(buildId: number) {
	return models().Part.findAll({ where: { buildId }, order: [['id', 'ASC']] });
}

export type PartValues = {
	category: string;
	name: string;
	costMinor: number;
	link: string | null;
	setupId: number | null;
};

export async function read(buildId: number, id: number) {
	return models().Part.findOne({ where: { id, buildId } });
}

export async function create(buildId: number, p: PartValues) {
	return models().Part.create({ ...p, buildId });
}

export async function destroy(buildId: number, id: number) {
	await models().Part.destroy({ where: { id, buildId } });
}

/** Whether the part was there to change. */
export async function update(buildId: number, id: number, p: PartValues) {
	const [n] = await models().Part.update(p, { where: { id, buildId } });
	return n > 0;
}
