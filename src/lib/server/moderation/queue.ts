import { Op } from 'sequelize';
import { ITEM_LABEL, type ItemType } from '../../moderation/kinds';
import { activeSuspension, type Suspension } from '../../moderation/suspension';
import { models } from '../db/models';
import { renderMarkdown } from '../markdown';
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

/** The desk's list: items waiting for a decision, oldest first, each with everything needed to decide. */
export async function deskQueue(limit = 40): Promise<CaseView[]> {
	const { ReviewCase, Report, Flag, User } = models();
	const cases = await ReviewCase.findAll({
		where: { onDesk: true },
		order: [
			['openedAt', 'ASC'],
			['id', 'ASC']
		],
		limit
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
