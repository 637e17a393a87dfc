import { Failure } from '../../failure';
import { Op } from 'sequelize';
import { roleAllows } from '../../roles';
import type { CurrentUser } from '../auth/current-user';
import { commentsByAccount, commentsByAddress, spend, waitText } from '../auth/limits';
import { models, type Build, type Comment } from '../db/models';
import { renderMarkdown } from '../text/markdown';
import { readCase } from '../review/cases';
import { buildCasesColumn, type CaseState, type Cases } from '../review/standing';
import { nestedRows, selectColumns } from '../db/nested';
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
function editable(
	c: Comment,
	replies: number,
	kase: CaseState | undefined
): { edit: boolean; secondLook: CommentView['secondLook'] } {
	if (c.deletedAt) return { edit: false, secondLook: null };
	const secondLook = c.moderation === 'hidden' ? (kase?.secondLook ?? 'none') : null;
	return {
		edit: replies === 0 || Boolean(kase?.onDesk) || secondLook === 'none',
		secondLook
	};
}

/** A build's comments with their authors' names, as one column (db/nested.ts; `buildId`). */
export const commentsColumn = () =>
	nestedRows(models().Comment, {
		alias: 'c',
		join: 'LEFT JOIN users u ON u.id = c.author_id',
		extra: ['u.name', 'u.email', 'u.id IS NOT NULL'],
		where: 'c.build_id = :buildId',
		order: 'c.created_at, c.id'
	});

type CommentRows = ReturnType<ReturnType<typeof commentsColumn>['read']>;

/** The thread as the reader may see it, from the column above and the desk's cases. */
export function commentViews(
	found: CommentRows,
	cases: Cases,
	me: CurrentUser | null
): CommentView[] {
	const rows = found.rows;
	const staff = me !== null && roleAllows(me.role, 'moderator');
	return rows.map((c, i) => {
		const [name, email, hasAuthor] = found.extras[i] as [string | null, string | null, number];
		const kase = cases.get(`comment:${c.id}`);
		const replies = rows.filter((r) => r.parentId === c.id && !r.deletedAt).length;
		const mine = me !== null && c.authorId === me.id;
		const state = c.deletedAt ? 'deleted' : c.moderation === 'hidden' ? 'hidden' : 'shown';
		const readable = state === 'shown' || (state === 'hidden' && (mine || staff));
		const rights = mine ? editable(c, replies, kase) : { edit: false, secondLook: null };
		return {
			id: c.id,
			parentId: c.parentId,
			setupId: c.setupId,
			author: hasAuthor ? (name ?? (email ?? '').split('@')[0]) : 'a former member',
			mine,
			createdAt: c.createdAt.toISOString(),
			editedAt: c.editedAt?.toISOString() ?? null,
			state,
			html: readable ? renderMarkdown(c.body) : '',
			body: mine && rights.edit ? c.body : null,
			hiddenReason: c.hiddenReason,
			caution: Boolean(kase?.caution) && state === 'shown',
			canEdit: rights.edit,
			secondLook: rights.secondLook,
			replies
		};
	});
}

/** A build's thread in one query, for the JSON route. */
export async function listComments(b: Build, me: CurrentUser | null): Promise<CommentView[]> {
	const r = await selectColumns(
		{ comments: commentsColumn(), cases: buildCasesColumn() },
		{ buildId: b.id }
	);
	return commentViews(r.comments, r.cases, me);
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
		const kase = await readCase({ type: 'comment', id: c.id });
		if (!editable(c, replies, kase ?? undefined).edit)
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
