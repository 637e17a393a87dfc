import { AsyncLocalStorage } from 'node:async_hooks';
import { QueryTypes } from 'sequelize';
import { expect, vi } from 'vitest';
import { db } from '../../src/lib/server/db/connection';

const WRITE = /^\s*(INSERT|UPDATE|DELETE|REPLACE)\b/i;
// Only the change's own writes count: a mail sweep left running by an earlier step does not.
const inChange = new AsyncLocalStorage<true>();
// Background work may deliver queued mail at any moment; only how many letters exist is compared.
const COUNTED_ONLY = new Set(['mail_queue', 'schema_migrations']);
// Rate-limit counters count attempts, kept or not: the limiter writes them on its own connection,
// outside the change, by design (a failed attempt still spends a point).
const LEFT_OUT = new Set(['rate_limits']);

/** Every table's checksum (row count for the mail queue): equal snapshots mean no row changed. */
export async function snapshot(): Promise<Record<string, string>> {
	const s = db();
	const tables = await s.query<{ name: string }>(
		`SELECT table_name AS name FROM information_schema.tables
		 WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE' ORDER BY table_name`,
		{ type: QueryTypes.SELECT }
	);
	const out: Record<string, string> = {};
	for (const { name } of tables) {
		if (LEFT_OUT.has(name)) continue;
		if (COUNTED_ONLY.has(name)) {
			const [r] = await s.query<{ n: number }>(`SELECT COUNT(*) AS n FROM \`${name}\``, {
				type: QueryTypes.SELECT
			});
			out[name] = String(r.n);
		} else {
			const [r] = await s.query<{ Checksum: number | null }>(`CHECKSUM TABLE \`${name}\``, {
				type: QueryTypes.SELECT
			});
			out[name] = String(r.Checksum);
		}
	}
	return out;
}

/**
 * Runs `change` with a failure injected just after its first write reached the database (the
 * second write throws), then checks that no table differs from before: the change must have been
 * one transaction. A change that makes fewer than two writes fails the check, so it cannot pass
 * by never reaching the injected failure. Returns the number of writes seen.
 */
export async function expectAllOrNothing(change: () => Promise<unknown>): Promise<void> {
	const before = await snapshot();
	const s = db();
	const real = s.query.bind(s);
	let writes = 0;
	const spy = vi.spyOn(s, 'query').mockImplementation(((sql: unknown, ...rest: unknown[]) => {
		const text = typeof sql === 'string' ? sql : String((sql as { query?: string })?.query ?? '');
		if (inChange.getStore() && WRITE.test(text) && ++writes === 2)
			return Promise.reject(new Error('injected failure after the first write'));
		return (real as (...a: unknown[]) => Promise<unknown>)(sql, ...rest);
	}) as never);
	try {
		await expect(inChange.run(true, change)).rejects.toThrow(
			'injected failure after the first write'
		);
	} finally {
		spy.mockRestore();
	}
	expect(writes, 'the change made at least two writes').toBeGreaterThanOrEqual(2);
	expect(await snapshot()).toEqual(before);
}
