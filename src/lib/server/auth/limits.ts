import { createHash } from 'node:crypto';
import {
	RateLimiterMemory,
	RateLimiterMySQL,
	type RateLimiterAbstract
} from 'rate-limiter-flexible';
import { env } from '../env';
import { limitStore } from '../db/limit-store';

// Counters in the database (table rate_limits), so a limit holds across every app process and
// machine. Should the database not answer, each process falls back to counting in its own memory
// (the library's insurance limiter): limits stay in force, only less exact, and no page fails
// because a counter could not be written.

export type Limiter = RateLimiterAbstract;
type Options = NonNullable<ConstructorParameters<typeof RateLimiterMemory>[0]>;

function limiter(name: string, opts: Options): Limiter {
	return new RateLimiterMySQL({
		...opts,
		keyPrefix: name,
		storeClient: limitStore,
		storeType: 'pool',
		dbName: env().DB_NAME,
		tableName: 'rate_limits',
		tableCreated: true,
		insuranceLimiter: new RateLimiterMemory({ ...opts, keyPrefix: name })
	});
}

// What is counted (an address, an e-mail) is kept only as a hash.
const hashed = (key: string) => createHash('sha256').update(key).digest('base64url').slice(0, 32);

/** Wrong passwords per account: 5 in 15 minutes, then a 15-minute wait. */
export const passwordFailures = limiter('pw-fail', {
	points: 5,
	duration: 900,
	blockDuration: 900
});

/**
 * Password attempts per client address, right or wrong: 30 in 15 minutes. The test stack raises
 * it (SIGNIN_ATTEMPTS_PER_ADDRESS), because every browser test signs in from 127.0.0.1.
 */
export const passwordAttemptsByAddress = limiter('pw-addr', {
	points: Number(process.env.SIGNIN_ATTEMPTS_PER_ADDRESS) || 30,
	duration: 900
});

/** Mails we send on request (sign-up, reset, sign-in link) per address: 5 an hour. */
export const mailRequests = limiter('mail', { points: 5, duration: 3600 });

/** Spends one point; false when the limit is reached. */
export async function take(l: Limiter, key: string): Promise<boolean> {
	try {
		await l.consume(hashed(key));
		return true;
	} catch {
		return false;
	}
}

export async function isBlocked(l: Limiter, key: string): Promise<boolean> {
	const r = await l.get(hashed(key));
	return r !== null && r.remainingPoints <= 0;
}

/** Clears a key's count (a right password, a completed reset). */
export async function forget(l: Limiter, key: string): Promise<void> {
	await l.delete(hashed(key));
}

/** Comments: 10 per account and 30 per address in 10 minutes. */
export const commentsByAccount = limiter('cmt-acct', { points: 10, duration: 600 });
export const commentsByAddress = limiter('cmt-addr', { points: 30, duration: 600 });

/** Reports: 10 per account and 30 per address an hour. */
export const reportsByAccount = limiter('rep-acct', { points: 10, duration: 3600 });
export const reportsByAddress = limiter('rep-addr', { points: 30, duration: 3600 });

/** Messages to shops: 5 per account and 15 per address an hour. */
export const messagesByAccount = limiter('msg-acct', { points: 5, duration: 3600 });
export const messagesByAddress = limiter('msg-addr', { points: 15, duration: 3600 });

export type Spent = { ok: true } | { ok: false; retryAfterS: number };

/** Spends a point from each limiter; refused as soon as one is used up, with the wait. */
export async function spend(pairs: [Limiter, string][]): Promise<Spent> {
	for (const [l, key] of pairs) {
		try {
			await l.consume(hashed(key));
		} catch (res) {
			const ms = (res as { msBeforeNext?: number }).msBeforeNext ?? l.duration * 1000;
			return { ok: false, retryAfterS: Math.ceil(ms / 1000) };
		}
	}
	return { ok: true };
}

/** "Try again in 7 minutes" for a refused spend. */
export function waitText(seconds: number): string {
	if (seconds < 90) return `${seconds} seconds`;
	return `${Math.ceil(seconds / 60)} minutes`;
}
