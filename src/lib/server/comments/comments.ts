import { Failure } from '../../failure';
import { Op } from 'sequelize';
import { roleAllows } from '../../roles';
import type { CurrentUser } from '../auth/current-user';
import { commentsByAccount, commentsByAddress, spend, waitText } from '../auth/limits';
import { models, type Build, type Comment } from '../db/models';
import { renderMarkdown } from '../text/markdown';
import { cautionsFor, readCase } from '../review/cases';
import { scanText } from '../review/flags';
import { inTransaction } from '../db/transaction';

export type CommentInput = { body: string; setupId?: number | null; parentId?: number | null };

export type CommentView = {
	id: number;
	parentId: number | null;
	setupId: number | null;
	author: string;
	mine: boolean;
	createdAt: string;
	editedAt: string | null;
	state: 'shown' | 'deleted' | 'hidden';
	/** Rendered Markdown; empty when the reader may not see the words. */
	html: string;
	/** The Markdown itself, for the author's edit box. */
	body: string | null;
	hiddenReason: string | null;
	caution: boolean;
	canEdit: boolean;
	/** For the author of a taken-down comment: whether the one request for another look is left. */
	secondLook: 'none' | 'asked' | 'used' | null;
	replies: number;
};

const open = (b: Build) => b.publication === 'published' && b.moderation === 'visible';

/**
 * Whether the author may still change a comment: freely until someone replies; while the desk
 * has it (reported or flagged and not decided yet); and once taken down, until they have used
 * their one request for another look.
 */
async function editable(
	c: Comment,
	replies: number
): Promise<{ edit: boolean; secondLook: CommentView['secondLook'] }> {
	if (c.deletedAt) return { edit: false, secondLook: null };
	const kase = await readCase({ type: 'comment', id: c.id });
	const secondLook = c.moderation === 'hidden' ? (kase?.secondLook ?? 'none') : null;
	return {
		edit: replies === 0 || Boolean(kase?.onDesk) || secondLook === 'none',
		secondLook
	};
}

export async function listComments(b: Build, me: CurrentUser | null): Promise<CommentView[]> {
	const { Comment, User } = models();
	const rows = await Comment.findAll({
		where: { buildId: b.id },
		include: [{ model: User, as: 'author', attributes: ['name', 'email'] }],
		order: [
			['createdAt', 'ASC'],
			['id', 'ASC']
		]
	});
	const cautions = await cautionsFor(
		'comment',
		rows.map((r) => r.id)
	);
	const staff = me !== null && roleAllows(me.role, 'moderator');
	return Promise.all(
		rows.map(async (c) => {
			const replies = rows.filter((r) => r.parentId === c.id && !r.deletedAt).length;
			const mine = me !== null && c.authorId === me.id;
			const state = c.deletedAt ? 'deleted' : c.moderation === 'hidden' ? 'hidden' : 'shown';
			const readable = state === 'shown' || (state === 'hidden' && (mine || staff));
			const rights = mine ? await editable(c, replies) : { edit: false, secondLook: null };
			return {
				id: c.id,
				parentId: c.parentId,
				setupId: c.setupId,
				author: c.author ? (c.author.name ?? c.author.email.split('@')[0]) : 'a former member',
				mine,
				createdAt: c.createdAt.toISOString(),
				editedAt: c.editedAt?.toISOString() ?? null,
				state,
				html: readable ? renderMarkdown(c.body) : '',
				body: mine && rights.edit ? c.body : null,
				hiddenReason: c.hiddenReason,
				caution: cautions.has(c.id) && state === 'shown',
				canEdit: rights.edit,
				secondLook: rights.secondLook,
				replies
			};
		})
	);
}

async function checkRate(me: CurrentUser, address: string) {
	const r = await spend([
		[commentsByAccount, me.id],
		[commentsByAddress, address]
	]);
	if (!r.ok)
		throw new Failure(
			429,
			`That is a lot of comments in a short time. Try again in ${waitText(r.retryAfterS)}; your text is kept below.`
		);
}

export async function createComment(
	me: CurrentUser,
	b: Build,
	input: CommentInput,
	address: string,
	now: Date
): Promise<Comment> {
	return inTransaction(async () => {
		const { Comment, Setup } = models();
		if (!open(b)) throw new Failure(404, 'No such build.');
		if (input.setupId) {
			const s = await Setup.findOne({ where: { id: input.setupId, buildId: b.id } });
			if (!s) throw new Failure(400, 'That setup is not part of this build.');
		}
		let parentId: number | null = null;
		let setupId = input.setupId ?? null;
		if (input.parentId) {
			const parent = await Comment.findOne({ where: { id: input.parentId, buildId: b.id } });
			if (!parent || parent.deletedAt || parent.moderation === 'hidden')
				throw new Failure(400, 'That comment cannot be replied to.');
			// One level of replies: answering a reply joins its parent's thread.
			parentId = parent.parentId ?? parent.id;
			setupId = parent.setupId;
		}
		await checkRate(me, address);
		const c = await Comment.create({
			buildId: b.id,
			setupId,
			parentId,
			authorId: me.id,
			body: input.body,
			createdAt: now,
			updatedAt: now,
			// The owner is not told about their own comments.
			notifiedAt: me.id === b.ownerId ? now : null
		});
		await scanText({ type: 'comment', id: c.id }, me.id, c.body, now);
		return c;
	});
}

/** The comment if it is the caller's; 404 otherwise, so others learn nothing about it. */
export async function ownComment(me: CurrentUser, commentId: number) {
	const c = await models().Comment.findByPk(commentId);
	if (!c || c.authorId !== me.id) throw new Failure(404, 'No such comment of yours.');
	return c;
}

export async function editComment(me: CurrentUser, commentId: number, body: string, now: Date) {
	return inTransaction(async () => {
		const c = await ownComment(me, commentId);
		const replies = await models().Comment.count({
			where: { parentId: c.id, deletedAt: { [Op.is]: null } }
		});
		if (!(await editable(c, replies)).edit)
			throw new Failure(409, 'Someone has replied, so this comment can no longer be changed.');
		await c.update({ body, editedAt: now, updatedAt: now });
		await scanText({ type: 'comment', id: c.id }, me.id, body, now);
		return c;
	});
}

/** The author's delete leaves a placeholder, so replies keep their place. */
export async function deleteComment(me: CurrentUser, commentId: number, now: Date) {
	return inTransaction(async () => {
		const c = await ownComment(me, commentId);
		if (c.deletedAt) return c;
		await c.update({ body: '', deletedAt: now, updatedAt: now });
		return c;
	});
}
