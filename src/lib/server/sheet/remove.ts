import { Op } from 'sequelize';
import { db } from '../db/connection';
import { models } from '../db/models';
import { removeBuildPhotos } from './photos';

/**
 * Deletes a build for good: its photo objects in the store, the review desk's reports, flags and
 * cases about it, its setups and its comments (those point at items by type and id, with no
 * foreign key to cascade), then the row, whose foreign keys take setups, runs, parts, photos,
 * comments and shop links with it. The moderation log keeps its lines: it is append-only.
 */
export async function destroyBuild(buildId: number): Promise<void> {
	const { Setup, Comment, Report, Flag, ReviewCase, Build } = models();
	const [setups, comments] = await Promise.all([
		Setup.findAll({ where: { buildId }, attributes: ['id'] }),
		Comment.findAll({ where: { buildId }, attributes: ['id'] })
	]);
	const items = [
		{ itemType: 'build' as const, itemId: buildId },
		...setups.map((s) => ({ itemType: 'setup' as const, itemId: s.id })),
		...comments.map((c) => ({ itemType: 'comment' as const, itemId: c.id }))
	];
	await removeBuildPhotos(buildId);
	await db().transaction(async (transaction) => {
		const where = { [Op.or]: items };
		await Report.destroy({ where, transaction });
		await Flag.destroy({ where, transaction });
		await ReviewCase.destroy({ where, transaction });
		await Build.destroy({ where: { id: buildId }, transaction });
	});
}
