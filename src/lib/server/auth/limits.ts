import { RateLimiterMemory } from 'rate-limiter-flexible';

// In-process counters: enough for one app process. Several processes would share a store
// (rate-limiter-flexible has a MySQL backend) instead.

/** Wrong passwords per account: 5 in 15 minutes, then a 15-minute wait. */
export const passwordFailures = new RateLimiterMemory({
	points: 5,
	duration: 900,
	blockDuration: 900
});

/** Password attempts per client address, right or wrong: 30 in 15 minutes. */
export const passwordAttemptsByAddress = new RateLimiterMemory({ points: 30, duration: 900 });

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
