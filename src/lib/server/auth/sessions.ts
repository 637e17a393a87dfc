import { randomUUID } from 'node:crypto';
import { QueryTypes, type Transaction } from 'sequelize';
import { db, replicated } from '../db/connection';

// Sessions stay JWTs (password sign-in needs them), but each carries two claims the database can
// overrule: `sid`, one id for the life of the session (signing out deny-lists it until it would
// have expired), and `gen`, the account's session generation when it was issued (a reset, a
// password change, "sign out everywhere" or an admin bumps it, ending every older session).

export type SessionClaims = { sid: string; gen: number };

/** The claims for a session being opened now; null when the account is gone. */
export async function openSession(userId: string): Promise<SessionClaims | null> {
	const rows = await db().query<{ gen: number }>(
		'SELECT session_generation AS gen FROM users WHERE id = ?',
		{ replacements: [userId], type: QueryTypes.SELECT }
	);
	return rows.length ? { sid: randomUUID(), gen: Number(rows[0].gen) } : null;
}

/** One query: the account still exists, is on the same generation, and this session is not ended. */
export async function sessionValid(
	userId: string,
	claims: { sid?: unknown; gen?: unknown }
): Promise<boolean> {
	if (typeof claims.sid !== 'string' || typeof claims.gen !== 'number') return false;
	const ask = (fromPrimary: boolean) =>
		db().query<{ ok: number }>(
			`SELECT 1 AS ok FROM users u
			 WHERE u.id = ? AND u.session_generation = ?
			   AND NOT EXISTS (SELECT 1 FROM revoked_sessions r WHERE r.sid = ?)`,
			{
				replacements: [userId, claims.gen, claims.sid],
				type: QueryTypes.SELECT,
				...(fromPrimary ? { useMaster: true } : {})
			}
		);
	if ((await ask(false)).length === 1) return true;
	// "No" ends the session for good, so a replica that is a moment behind does not get the last
	// word: the primary is asked (only then, so valid sessions cost the primary nothing).
	return replicated() && (await ask(true)).length === 1;
}

/** Ends one session for good (signing out): refused from now until it would have expired. */
export async function endSession(sid: unknown, expiresAt: Date): Promise<void> {
	if (typeof sid !== 'string') return;
	await db().query(
		'INSERT INTO revoked_sessions (sid, expires_at) VALUES (?, ?) ON DUPLICATE KEY UPDATE sid = sid',
		{ replacements: [sid, expiresAt] }
	);
}

/** Ends every session of an account, on every device. */
export async function endAllSessions(userId: string, transaction?: Transaction): Promise<void> {
	await db().query('UPDATE users SET session_generation = session_generation + 1 WHERE id = ?', {
		replacements: [userId],
		transaction
	});
}

/** Drops deny-list entries whose tokens have expired anyway. */
export async function forgetExpired(now: Date): Promise<void> {
	await db().query('DELETE FROM revoked_sessions WHERE expires_at < ?', { replacements: [now] });
}
