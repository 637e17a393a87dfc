import { RateLimiterMemory } from 'rate-limiter-flexible';

// In-process counters: enough for one app process. Several processes would share a store
// (rate-limiter-flexible has a MySQL backend) instead.

/** Wrong passwords per account: 5 in 15 minutes, then a 15-minute wait. */
export const passwordFailures = new RateLimiterMemory({
	points: 5,
	duration: 900,
	blockDuration: 900
});

/**
 * Password attempts per client address, right or wrong: 30 in 15 minutes. The test stack raises
 * it (SIGNIN_ATTEMPTS_PER_ADDRESS), because every browser test signs in from 127.0.0.1.
 */
export const passwordAttemptsByAddress = new RateLimiterMemory({
	points: Number(process.env.SIGNIN_ATTEMPTS_PER_ADDRESS) || 30,
	duration: 900
});

/** Mails we send on request (sign-up, reset, sign-in link) per address: 5 an hour. */
export const mailRequests = new RateLimiterMemory({ points: 5, duration: 3600 });

/** Spends one point; false when the limit is reached. */
export async function take(limiter: RateLimiterMemory, key: string): Promise<boolean> {
	try {
		await limiter.consume(key);
		return true;
	} catch {
		return false;
	}
}

export async function isBlocked(limiter: RateLimiterMemory, key: string): Promise<boolean> {
	const r = await limiter.get(key);
	return r !== null && r.remainingPoints <= 0;
}

/** Comments: 10 per account and 30 per address in 10 minutes. */
export const commentsByAccount = new RateLimiterMemory({ points: 10, duration: 600 });
export const commentsByAddress = new RateLimiterMemory({ points: 30, duration: 600 });

/** Reports: 10 per account and 30 per address an hour. */
export const reportsByAccount = new RateLimiterMemory({ points: 10, duration: 3600 });
export const reportsByAddress = new RateLimiterMemory({ points: 30, duration: 3600 });

/** Messages to shops: 5 per account and 15 per address an hour. */
export const messagesByAccount = new RateLimiterMemory({ points: 5, duration: 3600 });
export const messagesByAddress = new RateLimiterMemory({ points: 15, duration: 3600 });

export type Spent = { ok: true } | { ok: false; retryAfterS: number };

/** Spends a point from each limiter; refused as soon as one is used up, with the wait. */
export async function spend(pairs: [RateLimiterMemory, string][]): Promise<Spent> {
	for (const [limiter, key] of pairs) {
		try {
			await limiter.consume(key);
		} catch (res) {
			const ms = (res as { msBeforeNext?: number }).msBeforeNext ?? limiter.duration * 1000;
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
