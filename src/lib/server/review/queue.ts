import { Op } from 'sequelize';
import { ITEM_LABEL, type ItemType } from '../../review/kinds';
import { activeSuspension, type Suspension } from '../../review/suspension';
import { models } from '../db/models';
import { renderMarkdown } from '../text/markdown';
import { describeItem } from './items';
import * as log from './log';

export type CaseView = {
	id: number;
	itemType: ItemType;
	itemId: number;
	itemLabel: string;
	title: string;
	href: string;
	html: string;
	hidden: boolean;
	hiddenReason: string | null;
	openedAt: string;
	concern: boolean;
	caution: boolean;
	secondLook: 'none' | 'asked' | 'used';
	author: { id: string; name: string; role: string; suspension: Suspension | null } | null;
	reports: { reason: string; note: string; reporter: string; at: string; open: boolean }[];
	flags: { code: string; detail: string; at: string; open: boolean }[];
	history: log.LogView[];
};

export type DeskPage = { order: 'oldest' | 'newest'; after?: string; limit?: number };

/** How many cases wait on the desk in all (a page shows part of them). */
export async function deskCount(): Promise<number> {
	return models().ReviewCase.count({ where: { onDesk: true } });
}

/** The key of a case in the desk's order, for the next page's link. */
export const deskCursor = (c: { openedAt: string; id: number }) => `${c.openedAt}|${c.id}`;

/**
 * The desk's list: items waiting for a decision, a page at a time, oldest first unless asked
 * otherwise, each with everything needed to decide. `after` is the last case of the page before.
 */
export async function deskQueue(p: DeskPage = { order: 'oldest' }): Promise<CaseView[]> {
	const { ReviewCase, Report, Flag, User } = models();
	const newest = p.order === 'newest';
	const [at, id] = (p.after ?? '').split('|');
	const when = new Date(at);
	const cmp = newest ? Op.lt : Op.gt;
	const after =
		p.after && !Number.isNaN(when.getTime()) && Number.isInteger(Number(id))
			? {
					[Op.or]: [{ openedAt: { [cmp]: when } }, { openedAt: when, id: { [cmp]: Number(id) } }]
				}
			: {};
	const dir = newest ? 'DESC' : 'ASC';
	const cases = await ReviewCase.findAll({
		where: { onDesk: true, ...after },
		order: [
			['openedAt', dir],
			['id', dir]
		],
		limit: p.limit ?? 40
	});
	if (!cases.length) return [];
	const keys = cases.map((c) => ({ itemType: c.itemType, itemId: c.itemId }));
	const authorIds = [...new Set(cases.map((c) => c.authorId).filter((x): x is string => !!x))];
	const [items, reports, flags, authors, histories] = await Promise.all([
		Promise.all(cases.map((c) => describeItem({ type: c.itemType, id: c.itemId }))),
		Report.findAll({ where: { [Op.or]: keys }, order: [['createdAt', 'ASC']] }),
		Flag.findAll({ where: { [Op.or]: keys }, order: [['createdAt', 'ASC']] }),
		User.findAll({ where: { id: authorIds } }),
		Promise.all(authorIds.map((id) => log.list({ subjectId: id, limit: 10 })))
	]);
	const reporters = await User.findAll({
		where: { id: [...new Set(reports.map((r) => r.reporterId))] },
		attributes: ['id', 'name', 'email']
	});
	const nameOf = (id: string) => {
		const u = reporters.find((p) => p.id === id);
		return u ? (u.name ?? u.email) : 'a removed account';
	};
	const same =
		(c: { itemType: string; itemId: number }) => (r: { itemType: string; itemId: number }) =>
			r.itemType === c.itemType && r.itemId === c.itemId;
	return cases.map((c, i) => {
		const item = items[i];
		const a = authors.find((u) => u.id === c.authorId);
		return {
			id: c.id,
			itemType: c.itemType,
			itemId: c.itemId,
			itemLabel: ITEM_LABEL[c.itemType],
			title: item?.title ?? 'an item that no longer exists',
			href: item?.href ?? '#',
			html: renderMarkdown(item?.text ?? ''),
			hidden: item?.hidden ?? false,
			hiddenReason: item?.hiddenReason ?? null,
			openedAt: c.openedAt.toISOString(),
			concern: c.concern,
			caution: c.caution,
			secondLook: c.secondLook,
			author: a
				? {
						id: a.id,
						name: a.name ?? a.email,
						role: a.role,
						suspension: activeSuspension(a)
					}
				: null,
			reports: reports.filter(same(c)).map((r) => ({
				reason: r.reason,
				note: r.note,
				reporter: nameOf(r.reporterId),
				at: r.createdAt.toISOString(),
				open: r.status === 'open'
			})),
			flags: flags.filter(same(c)).map((f) => ({
				code: f.code,
				detail: f.detail,
				at: f.createdAt.toISOString(),
				open: f.status === 'open'
			})),
			history: a ? (histories[authorIds.indexOf(a.id)] ?? []) : []
		};
	});
}
