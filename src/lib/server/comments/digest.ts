import { Op, QueryTypes } from 'sequelize';
import { db } from '../db/connection';
import { inTransaction } from '../db/transaction';
import { models } from '../db/models';
import { commentDigest } from '../mail/letters';
import { send } from '../mail/send';
import { unsubscribeUrl } from '../mail/unsubscribe';

/** How long comments gather before their build's owner gets one mail about them. */
export const DIGEST_WINDOW_MS = 3600_000;

/**
 * Sends each build owner one mail for the comments that came in during an hour. The hour starts
 * with the first unmailed comment; a build is mailed when that comment is an hour old, so there
 * is at most one mail per build per hour. `now` is passed in so tests can move the clock.
 */
export async function flushCommentDigests(now: Date): Promise<number> {
	const { Comment } = models();
	const due = await Comment.findAll({
		attributes: ['buildId'],
		where: {
			notifiedAt: { [Op.is]: null },
			createdAt: { [Op.lte]: new Date(now.getTime() - DIGEST_WINDOW_MS) }
		},
		group: ['buildId']
	});
	let sent = 0;
	for (const { buildId } of due) if (await digestOf(buildId, now)) sent++;
	return sent;
}

/**
 * One build's digest, in one transaction: its unmailed comments are claimed with a locking read
 * that skips rows another process holds, marked, and the letter queued (mail_queue) before the
 * commit. Every process runs this sweep; whichever claims the comments first mails them, once.
 */
async function digestOf(buildId: number, now: Date): Promise<boolean> {
	const { Comment, Build, User, Setup } = models();
	return inTransaction(async () => {
		const claimed = await db().query<{ id: number; created_at: Date }>(
			`SELECT id, created_at FROM comments WHERE build_id = :buildId AND notified_at IS NULL
			AND created_at <= :now ORDER BY id FOR UPDATE SKIP LOCKED`,
			{ replacements: { buildId, now }, type: QueryTypes.SELECT }
		);
		// Another process mailed them since the sweep looked, or holds them now.
		const dueAt = now.getTime() - DIGEST_WINDOW_MS;
		if (!claimed.some((c) => new Date(c.created_at).getTime() <= dueAt)) return false;
		const ids = claimed.map((c) => c.id);
		// Mark first: a relay failure then costs one digest, never a storm of repeats.
		await Comment.update(
			{ notifiedAt: now },
			{ where: { id: ids, notifiedAt: { [Op.is]: null } } }
		);
		const b = await Build.findByPk(buildId);
		const pending = await Comment.findAll({
			where: { id: ids },
			include: [{ model: User, as: 'author', attributes: ['name', 'email'] }],
			order: [['createdAt', 'ASC']]
		});
		const owner = b?.ownerId ? await User.findByPk(b.ownerId) : null;
		const worth = pending.filter((c) => !c.deletedAt && c.moderation === 'visible');
		if (!b || !owner || !owner.mailComments || !worth.length) return false;
		const setupIds = [...new Set(worth.map((c) => c.setupId).filter((x): x is number => !!x))];
		const setups = setupIds.length ? await Setup.findAll({ where: { id: setupIds } }) : [];
		await send(
			commentDigest({
				to: owner.email,
				buildId: b.id,
				buildTitle: b.title,
				comments: worth.map((c) => {
					const s = setups.find((x) => x.id === c.setupId);
					return {
						id: c.id,
						author: c.author ? (c.author.name ?? 'a member') : 'a former member',
						setupLabel: s ? `setup ${s.position}` : null,
						body: c.body
					};
				}),
				unsubscribeUrl: unsubscribeUrl(owner.id, 'comments')
			})
		);
		await b.update({ commentsMailedAt: now }, { silent: true });
		return true;
	});
}
