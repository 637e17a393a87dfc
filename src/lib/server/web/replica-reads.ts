import type { Handle } from '@sveltejs/kit';
import { replicaReached, replicated, writtenPosition } from '../db/connection';
import { GTID_POSITION, readPrimaryFromNowOn, withReadScope, WRITTEN_COOKIE } from '../db/replica';
import { env } from '../env';

// Read-your-writes with a replica (the reasoning is in db/replica.ts). After a request that wrote,
// the answer carries the primary's binlog position in a cookie for a minute; the member's next
// requests wait (briefly) for the replica to reach it, or read from the primary if it has not.
// Without a replica this handle only passes the request on.
const KEEP_S = 60;

/**
 * A request that changes something reads the primary once it knows who is asking (the session
 * is looked up before, wherever reads go, so a stopped primary still answers "nothing was saved"
 * rather than "sign in"): a change built on a stale read (a partial update filling in the stored
 * fields) would write old values back.
 */
export const changesReadPrimary: Handle = ({ event, resolve }) => {
	if (!['GET', 'HEAD'].includes(event.request.method)) readPrimaryFromNowOn();
	return resolve(event);
};

export const replicaReads: Handle = async ({ event, resolve }) => {
	if (!replicated()) return resolve(event);
	const seen = event.cookies.get(WRITTEN_COOKIE);
	const position = seen && GTID_POSITION.test(seen) ? seen : null;
	const primary = position ? !(await replicaReached(position, env().DB_REPLICA_WAIT_MS)) : false;
	return withReadScope(primary, async (scope) => {
		const response = await resolve(event);
		if (!scope.wrote) return response;
		const now = await writtenPosition().catch(() => null);
		if (!now) return response;
		const secure = event.url.protocol === 'https:' ? '; Secure' : '';
		const out = new Response(response.body, response);
		// A shared cache must never keep an answer that sets a cookie (a GET can write: mail links).
		if (/public/.test(out.headers.get('cache-control') ?? ''))
			out.headers.set('cache-control', 'private, no-store');
		out.headers.append(
			'set-cookie',
			`${WRITTEN_COOKIE}=${now}; Max-Age=${KEEP_S}; Path=/; HttpOnly; SameSite=Lax${secure}`
		);
		return out;
	});
};
