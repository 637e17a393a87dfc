import { models } from '../db/models';

export type DeskNoteView = { id: number; body: string; author: string; createdAt: string };

export async function list(limit = 20): Promise<DeskNoteView[]> {
	const { DeskNote, User } = models();
	const rows = await DeskNote.findAll({
		include: [{ model: User, as: 'author', attributes: ['name', 'email'] }],
		order: [['createdAt', 'DESC']],
		limit
	});
	return rows.map((r) => ({
		id: r.id,
		body: r.body,
		author: r.author?.name ?? r.author?.email ?? 'someone',
		createdAt: r.createdAt.toISOString()
	}));
}

export async function create(authorId: string, body: string) {
	const row = await models().DeskNote.create({ authorId, body });
	return row.id;
}
