import { READS } from './replica';

// Which statements change what a reader may see. Whole anonymous answers are kept per process
// under one number, `public_version` (web/kept-answers.ts); every committed statement that might
// change a page moves it on (db/connection.ts). The rule is the safe way round: a write counts
// unless its table is one no page reads, so a new table is public until it is listed here.

/**
 * Tables no page shows: sessions (only signed-in answers depend on them, and those are never
 * kept), replayed answers, the mail queue and limits, the version counters themselves. (The
 * mailed-link tables are not here: /reset and /verify pages say whether a link is spent.)
 */
export const QUIET_TABLES = new Set([
	'sessions',
	'revoked_sessions',
	'idempotency_keys',
	'mail_queue',
	'rate_limits',
	'public_version',
	'summary_version',
	'schema_migrations'
]);

const CONTROL =
	/^\s*(start\s+transaction|begin|commit|rollback|savepoint|release\s+savepoint|set\s|xa\s|do\s)/i;
const TARGET =
	/^\s*(?:insert\s+(?:ignore\s+)?into|replace\s+into|update(?:\s+ignore)?|delete\s+(?:ignore\s+)?(?:\w+\s+)?from|truncate(?:\s+table)?)\s+`?(\w+)`?/i;

/** Whether `sql`, once committed, may change a page: not a read, not bookkeeping. */
export function movesPublicPages(sql: string): boolean {
	if (READS.test(sql) || CONTROL.test(sql)) return false;
	const target = TARGET.exec(sql)?.[1]?.toLowerCase();
	return !target || !QUIET_TABLES.has(target);
}

export const BUMP_PUBLIC_VERSION = 'UPDATE public_version SET v = v + 1 WHERE id = 1';
