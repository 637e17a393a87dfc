import { error } from '@sveltejs/kit';

export const DB_UNAVAILABLE =
	'The database is unavailable just now — nothing was saved. Try again in a minute.';

// Sequelize's names for "could not reach or keep a connection", and the driver's codes below it.
const NAMES = new Set([
	'SequelizeConnectionError',
	'SequelizeConnectionRefusedError',
	'SequelizeConnectionTimedOutError',
	'SequelizeHostNotFoundError',
	'SequelizeHostNotReachableError',
	'SequelizeAccessDeniedError',
	'SequelizeConnectionAcquireTimeoutError',
	'ConnectionAcquireTimeoutError'
]);
const CODES = new Set([
	'ECONNREFUSED',
	'ECONNRESET',
	'ETIMEDOUT',
	'EPIPE',
	'ER_GET_CONNECTION_TIMEOUT',
	'ER_CONNECTION_TIMEOUT',
	'ER_SOCKET_UNEXPECTED_CLOSE',
	'ER_CONNECTION_ALREADY_CLOSED',
	'ER_CMD_CONNECTION_CLOSED',
	'ER_POOL_ALREADY_CLOSED',
	'ER_SERVER_SHUTDOWN'
]);

export function isDatabaseDown(e: unknown): boolean {
	for (
		let cur = e as { name?: string; code?: string; parent?: unknown; original?: unknown } | null,
			depth = 0;
		cur && depth < 4;
		depth++
	) {
		if (cur.name && NAMES.has(cur.name)) return true;
		if (cur.code && CODES.has(cur.code)) return true;
		cur = (cur.parent ?? cur.original ?? null) as typeof cur;
	}
	return false;
}

/** Turns a lost database into a 503 with words, for pages and the JSON API alike. */
export function rethrowUnavailable(e: unknown): never {
	if (isDatabaseDown(e)) error(503, DB_UNAVAILABLE);
	throw e;
}
