import { createHash } from 'node:crypto';
import { json } from '@sveltejs/kit';
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import { Failure } from '../../failure';
import { db } from '../db/connection';
import { inTransaction } from '../db/transaction';

/** How long a key is remembered: long enough for any client's retries. */
const KEPT_HOURS = 24;

/**
 * A JSON create that a client may safely retry. Sent with an `Idempotency-Key` header, the key's
 * row is written first and the answer stored in the same transaction as the create: a retry of
 * a create that was stored (whose answer the client lost) gets the first answer again and makes
 * nothing new; a twin sent at the same moment waits on the key's row, then gets that answer too.
 * The same key with a different request is refused (422). Keys belong to their member.
 */
export async function createOnce(
	request: Request,
	userId: string,
	body: unknown,
	create: () => Promise<Record<string, unknown>>
): Promise<Response> {
	const { status, answer, replayed } = await once(request, userId, body, create);
	return json(answer, { status, headers: replayed ? { 'Idempotent-Replayed': 'true' } : {} });
}

/** The same for any door (a JSON route, or a form action sent again by the page's send queue):
 * the first answer, made now or replayed. Without a key, `create` simply runs. */
export async function once(
	request: Request,
	userId: string,
	body: unknown,
	create: () => Promise<Record<string, unknown>>
): Promise<{ status: number; answer: Record<string, unknown>; replayed: boolean }> {
	const key = request.headers.get('idempotency-key');
	if (key === null) return { status: 201, answer: await create(), replayed: false };
	if (!/^[\x21-\x7e]{1,200}$/.test(key))
		throw new Failure(400, 'An Idempotency-Key is 1 to 200 printable characters, no spaces.');
	const fingerprint = createHash('sha256')
		.update(`${request.method} ${new URL(request.url).pathname}\n${JSON.stringify(body)}`)
		.digest('hex');
	try {
		const answer = await inTransaction(async () => {
			await db().query(
				'INSERT INTO idempotency_keys (user_id, idem_key, fingerprint, status, body, created_at) VALUES (?, ?, ?, 0, NULL, ?)',
				{ replacements: [userId, key, fingerprint, new Date()] }
			);
			const made = await create();
			await db().query(
				'UPDATE idempotency_keys SET status = 201, body = ? WHERE user_id = ? AND idem_key = ?',
				{
					replacements: [JSON.stringify(made), userId, key]
				}
			);
			return made;
		});
		await forgetOld(userId);
		return { status: 201, answer, replayed: false };
	} catch (e) {
		if (!(e instanceof UniqueConstraintError)) throw e;
		return replay(userId, key, fingerprint);
	}
}

async function replay(userId: string, key: string, fingerprint: string) {
	const [row] = await db().query<{ fingerprint: string; status: number; body: string | null }>(
		'SELECT fingerprint, status, body FROM idempotency_keys WHERE user_id = ? AND idem_key = ?',
		{ replacements: [userId, key], type: QueryTypes.SELECT }
	);
	if (!row || row.body === null)
		throw new Failure(409, 'That request is still being made; try again in a moment.');
	if (row.fingerprint !== fingerprint)
		throw new Failure(422, 'That Idempotency-Key was already used for a different request.');
	return {
		status: row.status,
		answer: JSON.parse(row.body) as Record<string, unknown>,
		replayed: true
	};
}

async function forgetOld(userId: string) {
	await db().query('DELETE FROM idempotency_keys WHERE user_id = ? AND created_at < ?', {
		replacements: [userId, new Date(Date.now() - KEPT_HOURS * 3600_000)]
	});
}
