import { Failure } from '../../failure';
import { ITEM_LABEL, type DeskAction } from '../../review/kinds';
import { roleAllows } from '../../roles';
import type { CurrentUser } from '../auth/current-user';
import { inTransaction } from '../db/transaction';
import { models } from '../db/models';
import * as users from '../auth/users';
import { deskDecision, suspensionNotice } from '../mail/letters';
import { send } from '../mail/send';
import { refreshListing } from '../derived/recompute';
import { closeSignals, readCase, refreshCaution } from './cases';
import { describeItem, requireItem, setHidden, type ItemInfo, type ItemRef } from './items';
import * as log from './log';

export type Decision = { action: DeskAction; reason: string; days?: number };

/** Actions that must say why: the reason is shown to readers (hide) or mailed to the author. */
export const NEEDS_REASON: readonly DeskAction[] = ['hide', 'restore', 'warn', 'suspend'];

/** Decisions that change something for the author, and so are mailed to them; the rest are not. */
export const MAILED: readonly DeskAction[] = ['hide', 'restore', 'warn'];

async function mailAuthor(item: ItemInfo, action: string, reason: string, canAskAgain: boolean) {
	const author = item.authorId ? await users.read(item.authorId) : null;
	if (!author) return;
	await send(
		deskDecision({
			to: author.email,
			action,
			itemLabel: ITEM_LABEL[item.ref.type],
			itemTitle: item.title,
			itemUrl: item.href,
			reason,
			canAskAgain
		})
	);
}

/** Builds and setups feed the lists and the close-builds ranking; hiding takes them out. */
async function relist(item: ItemInfo) {
	if (item.buildId && (item.ref.type === 'build' || item.ref.type === 'setup'))
		await refreshListing(item.buildId);
}

/**
 * One decision of the desk on one item, logged before anything is mailed, so the log is complete
 * even when the mail relay is down.
 */
export async function decide(
	me: CurrentUser,
	caseId: number,
	d: Decision,
	now: Date
): Promise<void> {
	// The item, its case, the log line and the queued mail change together or not at all.
	await inTransaction(async () => {
		const c = await models().ReviewCase.findByPk(caseId);
		if (!c) throw new Failure(404, 'No such case.');
		const ref: ItemRef = { type: c.itemType, id: c.itemId };
		const item = await requireItem(ref);
		if (NEEDS_REASON.includes(d.action) && !d.reason.trim())
			throw new Failure(400, 'Say why: the reason is shown or mailed to the author.');
		const entry = {
			at: now,
			actorId: me.id,
			item: ref,
			subjectId: item.authorId,
			reason: d.reason
		};
		const spent = c.secondLook === 'asked' ? { secondLook: 'used' as const } : {};

		if (d.action === 'triage') {
			await c.update({ concern: true, updatedAt: now });
			await refreshCaution(ref);
		} else if (d.action === 'dismiss' || d.action === 'hide' || d.action === 'restore') {
			if (d.action === 'hide') await setHidden(ref, d.reason.trim());
			if (d.action === 'restore') await setHidden(ref, null);
			await closeSignals(ref, now);
			await c.update({ onDesk: false, concern: false, caution: false, updatedAt: now, ...spent });
			await relist(item);
		} else if (d.action === 'suspend') {
			await suspendAuthor(me, item.authorId, d, now, ref);
			return;
		}
		await log.append({ ...entry, action: d.action });
		if (!MAILED.includes(d.action)) return;
		const canAskAgain = d.action === 'hide' && c.secondLook === 'none';
		await mailAuthor(item, d.action, d.reason.trim(), canAskAgain);
	});
}

/**
 * Puts back an item the desk took down, whether or not anyone asked: from the item's desk page or
 * the log. The item, its case and the log line change together or not at all; the lists are then
 * refreshed and the author told.
 */
export async function putBack(me: CurrentUser, ref: ItemRef, reason: string, now: Date) {
	const item = await requireItem(ref);
	if (!item.hidden) throw new Failure(409, 'This item is not taken down.');
	const why = reason.trim();
	if (!why)
		throw new Failure(
			400,
			'Say why it goes back up: the reason is logged and mailed to the author.'
		);
	await inTransaction(async () => {
		await setHidden(ref, null);
		await models().ReviewCase.update(
			{ onDesk: false, concern: false, caution: false, updatedAt: now },
			{ where: { itemType: ref.type, itemId: ref.id } }
		);
		await log.append({
			at: now,
			actorId: me.id,
			action: 'restore',
			item: ref,
			subjectId: item.authorId,
			reason: why
		});
		await relist(item);
		await mailAuthor(item, 'restore', why, false);
	});
}

async function suspendAuthor(
	me: CurrentUser,
	authorId: string | null,
	d: Decision,
	now: Date,
	ref: ItemRef | null
) {
	const author = authorId ? await users.read(authorId) : null;
	if (!author) throw new Failure(404, 'The author has no account any more.');
	// Only an admin can suspend staff, and nobody suspends themselves.
	if (author.id === me.id) throw new Failure(403, 'You cannot suspend your own account.');
	if (author.role !== 'member' && author.role !== 'shop' && !roleAllows(me.role, 'admin'))
		throw new Failure(403, 'Only an admin can suspend a moderator or an admin.');
	const days = d.days ?? 0;
	const until = days > 0 ? new Date(now.getTime() + days * 86_400_000) : null;
	await users.update(author.id, {
		suspendedAt: now,
		suspendedUntil: until,
		suspendedReason: d.reason.trim()
	});
	await log.append({
		at: now,
		actorId: me.id,
		action: 'suspend',
		item: ref,
		subjectId: author.id,
		reason: d.reason.trim(),
		detail: { days: days || null, until: until?.toISOString() ?? null }
	});
	await send(
		suspensionNotice({
			to: author.email,
			suspension: { reason: d.reason.trim(), until: until?.toISOString() ?? null }
		})
	);
}

/** Suspends an account directly (the admin's user table). */
export async function suspendUser(
	me: CurrentUser,
	userId: string,
	reason: string,
	days: number,
	now: Date
) {
	if (!reason.trim()) throw new Failure(400, 'Say why: the reason is mailed to the member.');
	await inTransaction(() =>
		suspendAuthor(me, userId, { action: 'suspend', reason, days }, now, null)
	);
}

export async function liftSuspension(me: CurrentUser, userId: string, reason: string, now: Date) {
	const u = await users.read(userId);
	if (!u) throw new Failure(404, 'No such account.');
	await inTransaction(async () => {
		await users.update(userId, { suspendedAt: null, suspendedUntil: null, suspendedReason: null });
		await log.append({
			at: now,
			actorId: me.id,
			action: 'lift-suspension',
			subjectId: userId,
			reason
		});
	});
}

export type SecondLook = { ok: true } | { ok: false; message: string };

/**
 * The author asks the desk to look again at a hidden item, once per item: the case goes back on
 * the desk's list and the request is logged.
 */
export async function askSecondLook(me: CurrentUser, ref: ItemRef, now: Date): Promise<SecondLook> {
	const item = await describeItem(ref);
	if (!item || item.authorId !== me.id) throw new Failure(404, 'No such item.');
	const c = await readCase(ref);
	if (!c || !item.hidden) return { ok: false, message: 'This is not taken down.' };
	if (c.secondLook !== 'none')
		return { ok: false, message: 'You already asked for another look at this once.' };
	await inTransaction(async () => {
		await c.update({ secondLook: 'asked', onDesk: true, openedAt: now, updatedAt: now });
		await log.append({
			at: now,
			actorId: me.id,
			action: 'second-look',
			item: ref,
			subjectId: me.id
		});
	});
	return { ok: true };
}
