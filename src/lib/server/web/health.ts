import { db } from '../db/connection';
import { pingMail } from '../mail/send';
import { pingStorage } from '../storage/objects';

export type ServiceName = 'database' | 'object store' | 'mail server';
export type Health = {
	status: 'ok' | 'down';
	services: Record<ServiceName, { up: boolean; problem?: string }>;
	down: ServiceName[];
};

/** Rejects after `ms` so one hung service cannot hold the answer; the timer is cleared either way. */
function withTimeout<T>(p: Promise<T>, ms: number): Promise<T> {
	let timer: ReturnType<typeof setTimeout> | undefined;
	const timeout = new Promise<never>((_, reject) => {
		timer = setTimeout(() => reject(new Error(`no answer in ${ms} ms`)), ms);
	});
	return Promise.race([p, timeout]).finally(() => clearTimeout(timer));
}

/** How long one answer from the mail relay stands: probes must not open an SMTP session each. */
export const MAIL_CHECK_TTL_MS = 60_000;
let mailCheck: { at: number; result: Promise<void> } | null = null;

function cachedMailCheck(now = Date.now()): Promise<void> {
	if (!mailCheck || now - mailCheck.at > MAIL_CHECK_TTL_MS) {
		mailCheck = { at: now, result: withTimeout(pingMail(), 4000) };
		mailCheck.result.catch(() => undefined);
	}
	return mailCheck.result;
}

/** Forgets the cached mail answer (tests; an admin asking after fixing the relay). */
export function forgetMailCheck() {
	mailCheck = null;
}

const probes: Record<ServiceName, () => Promise<unknown>> = {
	database: () => db().query('SELECT 1'),
	'object store': pingStorage,
	'mail server': () => cachedMailCheck()
};

/** Asks each service in parallel; one that fails or is slow is reported by name. */
export async function checkHealth(): Promise<Health> {
	const names = Object.keys(probes) as ServiceName[];
	const results = await Promise.allSettled(names.map((n) => withTimeout(probes[n](), 4000)));
	const services = {} as Health['services'];
	results.forEach((r, i) => {
		services[names[i]] =
			r.status === 'fulfilled'
				? { up: true }
				: {
						up: false,
						problem:
							r.reason instanceof Error ? r.reason.message || r.reason.name : String(r.reason)
					};
	});
	const down = names.filter((n) => !services[n].up);
	return { status: down.length ? 'down' : 'ok', services, down };
}
