import { Op, type Transaction, type WhereOptions } from 'sequelize';
import { models, type LogEntry } from '../db/models';
import type { ItemRef } from './items';

export type LogInput = {
	at: Date;
	actorId: string | null;
	action: string;
	/** A desk item, or a proposed base scooter (decided on the desk, not reported). */
	item?: ItemRef | { type: 'scooter'; id: number } | null;
	subjectId?: string | null;
	reason?: string;
	detail?: Record<string, unknown> | null;
};

/** Adds a line to the moderation log. There is no update or delete: the database refuses both. */
export async function append(e: LogInput, transaction?: Transaction): Promise<void> {
	await models().LogEntry.create(
		{
			at: e.at,
			actorId: e.actorId,
			action: e.action,
			itemType: e.item?.type ?? null,
			itemId: e.item?.id ?? null,
			subjectId: e.subjectId ?? null,
			reason: e.reason ?? '',
			detail: e.detail ?? null
		},
		{ transaction }
	);
}

export type LogView = {
	id: number;
	at: string;
	actor: string;
	action: string;
	itemType: string | null;
	itemId: number | null;
	subject: string | null;
	reason: string;
};

export type LogFilter = {
	action?: string;
	itemType?: string;
	itemId?: number;
	subjectId?: string;
	beforeId?: number;
	afterId?: number;
	limit?: number;
	order?: 'newest' | 'oldest';
};

export async function list(f: LogFilter = {}): Promise<LogView[]> {
	const { LogEntry, User } = models();
	const where: WhereOptions<LogEntry> = {};
	if (f.action) Object.assign(where, { action: f.action });
	if (f.itemType) Object.assign(where, { itemType: f.itemType });
	if (f.itemId) Object.assign(where, { itemId: f.itemId });
	if (f.subjectId) Object.assign(where, { subjectId: f.subjectId });
	if (f.beforeId) Object.assign(where, { id: { [Op.lt]: f.beforeId } });
	if (f.afterId) Object.assign(where, { id: { [Op.gt]: f.afterId } });
	const rows = await LogEntry.findAll({
		where,
		order: [['id', f.order === 'oldest' ? 'ASC' : 'DESC']],
		limit: Math.min(f.limit ?? 100, 500)
	});
	const ids = [...new Set(rows.flatMap((r) => [r.actorId, r.subjectId]).filter(Boolean))];
	const people = ids.length
		? await User.findAll({ where: { id: ids as string[] }, attributes: ['id', 'name', 'email'] })
		: [];
	const nameOf = (id: string | null) => {
		if (!id) return null;
		const u = people.find((p) => p.id === id);
		return u ? (u.name ?? u.email) : 'a removed account';
	};
	return rows.map((r) => ({
		id: Number(r.id),
		at: r.at.toISOString(),
		actor: nameOf(r.actorId) ?? 'Squishline (automatic)',
		action: r.action,
		itemType: r.itemType,
		itemId: r.itemId,
		subject: nameOf(r.subjectId),
		reason: r.reason
	}));
}
