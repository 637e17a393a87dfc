import { AsyncLocalStorage } from 'node:async_hooks';

// Where a read goes when a replica is configured (DB_REPLICA_HOST / DB_REPLICA_PORT).
//
// Reads outside a transaction go to the replica; writes, and every read inside a transaction,
// go to the primary (Sequelize's `replication` pools). Two things send a read to the primary
// instead:
// - the replica failed to answer in the last few seconds (stopped, restarting): reads fall back
//   without an error and try the replica again once the pause is over;
// - read-your-writes: a member who just saved carries the primary's binlog position of that
//   write in a short-lived cookie (`sl_written`); before their next page reads, the replica is
//   asked to wait for that position (MASTER_GTID_WAIT, a fraction of a second at most). If it
//   gets there, the page reads from the replica; if not, this one request reads from the primary.
//   We chose waiting over pinning the member to the primary for a fixed time: it is exact (the
//   member sees their own write, never less), usually costs one instant query, and keeps the
//   primary's load to writes, however many members are saving.

type Scope = { primary: boolean; wrote: boolean };
const scope = new AsyncLocalStorage<Scope>();

/** Runs one request's work with its own read preference and write note. */
export function withReadScope<T>(primary: boolean, fn: (s: Scope) => T): T {
	const s: Scope = { primary, wrote: false };
	return scope.run(s, () => fn(s));
}

/** Sends the rest of this request's reads to the primary. */
export function readPrimaryFromNowOn(): void {
	const s = scope.getStore();
	if (s) s.primary = true;
}

export function noteWrite(): void {
	const s = scope.getStore();
	if (s) s.wrote = true;
}

let replicaPausedUntil = 0;

/** The replica failed a read: send reads to the primary for a while. */
export function pauseReplica(seconds: number, now = Date.now()): void {
	replicaPausedUntil = now + seconds * 1000;
}

/** Whether a read outside a transaction may go to the replica now. */
export function replicaUsable(now = Date.now()): boolean {
	return now >= replicaPausedUntil && !scope.getStore()?.primary;
}

/** SQL that reads (sent with a type other than SELECT: raw statements). */
export const READS = /^\s*(\(\s*)?(select|show|with|explain|describe)\b/i;

/** A binlog position as MariaDB writes it: domain-server-sequence, comma-separated. */
export const GTID_POSITION = /^\d{1,10}-\d{1,10}-\d{1,20}(,\d{1,10}-\d{1,10}-\d{1,20}){0,15}$/;

export const WRITTEN_COOKIE = 'sl_written';
