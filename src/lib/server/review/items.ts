import { error } from '@sveltejs/kit';
import { Op, type Transaction } from 'sequelize';
import type { ItemType } from '../../review/kinds';
import { models } from '../db/models';

export type ItemRef = { type: ItemType; id: number };

/** What the desk and the report form need to know about any item that can be reported. */
export type ItemInfo = {
	ref: ItemRef;
	authorId: string | null;
	buildId: number | null;
	/** A short name for lists and mails: the build's title, "setup 3 of …", "comment on …". */
	title: string;
	/** The words as written (Markdown), for the desk and the text rules. */
	text: string;
	href: string;
	hidden: boolean;
	hiddenReason: string | null;
	/** Anyone may read it: published, not hidden, not deleted. */
	open: boolean;
};

const plainBuild = (b: { publication: string; moderation: string }) =>
	b.publication === 'published' && b.moderation === 'visible';

export async function describeItem(ref: ItemRef): Promise<ItemInfo | null> {
	const { Build, Setup, Comment } = models();
	if (ref.type === 'build') {
		const b = await Build.findByPk(ref.id);
		if (!b) return null;
		return {
			ref,
			authorId: b.ownerId,
			buildId: b.id,
			title: b.title,
			text: b.story,
			href: `/builds/${b.id}`,
			hidden: b.moderation === 'hidden',
			hiddenReason: b.hiddenReason,
			open: plainBuild(b)
		};
	}
	if (ref.type === 'setup') {
		const s = await Setup.findByPk(ref.id);
		const b = s && (await Build.findByPk(s.buildId));
		if (!s || !b) return null;
		return {
			ref,
			authorId: b.ownerId,
			buildId: b.id,
			title: `setup ${s.position} of “${b.title}”`,
			text: s.changeNote,
			href: `/builds/${b.id}#setup-${s.id}`,
			hidden: s.moderation === 'hidden',
			hiddenReason: s.hiddenReason,
			open: plainBuild(b) && s.moderation === 'visible'
		};
	}
	if (ref.type === 'comment') {
		const c = await Comment.findByPk(ref.id);
		const b = c && (await Build.findByPk(c.buildId));
		if (!c || !b) return null;
		return {
			ref,
			authorId: c.authorId,
			buildId: b.id,
			title: `comment on “${b.title}”`,
			text: c.body,
			href: `/builds/${b.id}#comment-${c.id}`,
			hidden: c.moderation === 'hidden',
			hiddenReason: c.hiddenReason,
			open: plainBuild(b) && c.moderation === 'visible' && !c.deletedAt
		};
	}
	if (ref.type === 'shop') {
		const shop = await models().Shop.findByPk(ref.id);
		if (!shop) return null;
		return {
			ref,
			authorId: shop.ownerId,
			buildId: null,
			title: `shop page “${shop.name}”`,
			text: [shop.services, shop.openingNote].filter(Boolean).join('\n\n'),
			href: `/shops/${shop.id}`,
			hidden: shop.moderation === 'hidden',
			hiddenReason: shop.hiddenReason,
			open: shop.moderation === 'visible'
		};
	}
	return null;
}

export async function requireItem(ref: ItemRef): Promise<ItemInfo> {
	const item = await describeItem(ref);
	if (!item) error(404, 'No such item.');
	return item;
}

/**
 * Hides an item (with the public reason shown in its place) or puts it back. Only the moderation
 * state changes, never the publication state or the content, so restoring returns it exactly as
 * it was. No version bump: the author's open editor stays valid.
 */
export async function setHidden(
	ref: ItemRef,
	reason: string | null,
	transaction?: Transaction
): Promise<void> {
	const { Build, Setup, Comment } = models();
	const patch = reason
		? { moderation: 'hidden' as const, hiddenReason: reason }
		: { moderation: 'visible' as const, hiddenReason: null };
	const where = { where: { id: ref.id }, transaction };
	if (ref.type === 'build') await Build.update(patch, where);
	else if (ref.type === 'setup') await Setup.update(patch, where);
	else if (ref.type === 'comment') await Comment.update(patch, where);
	else if (ref.type === 'shop') await models().Shop.update(patch, where);
}

/**
 * Removes the desk's reports, flags and cases about items that are being deleted: they point by
 * type and id, with no foreign key to cascade. The moderation log keeps its lines (append-only).
 */
export async function forgetItems(refs: ItemRef[]): Promise<void> {
	if (refs.length === 0) return;
	const { Report, Flag, ReviewCase } = models();
	const where = { [Op.or]: refs.map((r) => ({ itemType: r.type, itemId: r.id })) };
	await Report.destroy({ where });
	await Flag.destroy({ where });
	await ReviewCase.destroy({ where });
}
