import { models, type Setup } from '../db/models';
import type { SetupConfig } from '../db/models/setup';

export async function listForBuild(buildId: number) {
	return models().Setup.findAll({ where: { buildId }, order: [['position', 'ASC']] });
}

export async function read(buildId: number, id: number) {
	return Number.isInteger(id) ? models().Setup.findOne({ where: { id, buildId } }) : null;
}

export async function latest(buildId: number) {
	return models().Setup.findOne({ where: { buildId }, order: [['position', 'DESC']] });
}

export async function create(
	buildId: number,
	changeNote: string,
	isStock: boolean,
	config: SetupConfig
) {
	const { Setup } = models();
	const max = (await Setup.max('position', { where: { buildId } })) as number | null;
	return Setup.create({ buildId, position: (max ?? 0) + 1, changeNote, isStock, config });
}

export async function update(
	id: number,
	version: number,
	patch: Partial<Pick<Setup, 'changeNote' | 'isStock' | 'config'>>
) {
	const [n] = await models().Setup.update(
		{ ...patch, version: version + 1 },
		{ where: { id, version } }
	);
	return n === 1;
}

export async function destroy(id: number) {
	await models().Setup.destroy({ where: { id } });
}
