import { randomUUID } from 'node:crypto';
import { QueryTypes, type Transaction } from 'sequelize';
import { db } from '../db/connection';
import { detached } from '../db/context';
import { afterCommit } from '../db/transaction';
import type { Letter } from './send';

// Every mail goes through a queue in the database: the request that asks for a mail answers at
// once, whether the relay is up or not, and the letter waits here until it is sent. Any number
// of app processes may sweep; each due row is claimed by one sweep with a conditional UPDATE,
// so each letter is handed to the relay once (a crash mid-send can repeat it once, after the
// claim lapses: at-least-once, as mail always is).

export const MAX_ATTEMPTS = 10;
const BATCH = 20;
const CLAIM_MS = 2 * 60_000;

/** 30 s, 1 min, 2 min … capped at 1 hour: ten tries span about nine hours. */
export function backoffMs(attempts: number): number {
	return Math.min(30_000 * 2 ** Math.max(0, attempts - 1), 3600_000);
}

export async function enqueue(letter: Letter, transaction?: Transaction): Promise<void> {
	await db().query(
		'INSERT INTO mail_queue (to_address, letter, next_attempt_at, created_at) VALUES (?, ?, ?, ?)',
		{ replacements: [letter.to, JSON.stringify(letter), new Date(), new Date()], transaction }
	);
	// A letter queued inside a change can only be sent once that change is committed.
	await afterCommit(kick);
}

type Deliver = (letter: Letter) => Promise<void>;
let deliverer: Deliver | null = null;

/** Set once by mail.ts: the queue does not import the transport, so the two stay one-way. */
export function setDeliverer(d: Deliver) {
	deliverer = d;
}

let kicked = false;
/** Sends soon from this process too, so a mail does not wait for the next sweep. */
function kick() {
	if (kicked || !deliverer) return;
	kicked = true;
	detached(() =>
		setTimeout(() => {
			kicked = false;
			flushMailQueue(new Date()).catch((e: unknown) => console.error('[mail queue]', e));
		}, 0).unref?.()
	);
}

export type FlushResult = { sent: number; failed: number };

/** Claims the due letters, sends them, and books each outcome. Safe to run in many processes. */
export async function flushMailQueue(now: Date, deliver = deliverer): Promise<FlushResult> {
	if (!deliver) throw new Error('no mail transport configured');
	const claim = randomUUID();
	const s = db();
	await s.query(
		`UPDATE mail_queue SET claimed_by = ?, claimed_until = ?
		 WHERE sent_at IS NULL AND failed_at IS NULL AND next_attempt_at <= ?
		   AND (claimed_until IS NULL OR claimed_until < ?)
		 ORDER BY id LIMIT ${BATCH}`,
		{ replacements: [claim, new Date(now.getTime() + CLAIM_MS), now, now] }
	);
	const rows = await s.query<{ id: number; letter: string; attempts: number }>(
		'SELECT id, letter, attempts FROM mail_queue WHERE claimed_by = ? ORDER BY id',
		{ replacements: [claim], type: QueryTypes.SELECT }
	);
	const result: FlushResult = { sent: 0, failed: 0 };
	for (const row of rows) {
		try {
			await deliver(JSON.parse(row.letter) as Letter);
			await s.query(
				'UPDATE mail_queue SET sent_at = ?, claimed_by = NULL, claimed_until = NULL WHERE id = ?',
				{ replacements: [new Date(), row.id] }
			);
			result.sent++;
		} catch (e) {
			const attempts = row.attempts + 1;
			const giveUp = attempts >= MAX_ATTEMPTS;
			const problem = (e instanceof Error ? e.message : String(e)).slice(0, 500);
			await s.query(
				`UPDATE mail_queue SET attempts = ?, next_attempt_at = ?, failed_at = ?, last_error = ?,
				   claimed_by = NULL, claimed_until = NULL WHERE id = ?`,
				{
					replacements: [
						attempts,
						new Date(now.getTime() + backoffMs(attempts)),
						giveUp ? new Date() : null,
						problem,
						row.id
					]
				}
			);
			if (giveUp) console.error(`[mail queue] gave up on mail ${row.id} after ${attempts} tries`);
			result.failed++;
		}
	}
	return result;
}

/** Letters not yet sent (waiting or retrying): for the admin's health details and tests. */
export async function pendingCount(): Promise<number> {
	const [row] = await db().query<{ n: number }>(
		'SELECT COUNT(*) AS n FROM mail_queue WHERE sent_at IS NULL AND failed_at IS NULL',
		{ type: QueryTypes.SELECT }
	);
	return Number(row.n);
}
