import { models } from './models';

export async function listForBuild(buildId: number) {
	return models().Part.findAll({ where: { buildId }, order: [['id', 'ASC']] });
}

export async function create(
	buildId: number,
	p: {
		category: string;
		name: string;
		costMinor: number;
		link: string | null;
		setupId: number | null;
	}
) {
	return models().Part.create({ ...p, buildId });
}

export async function destroy(buildId: number, id: number) {
	await models().Part.destroy({ where: { id, buildId } });
}
