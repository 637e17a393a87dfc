import { QueryTypes } from 'sequelize';
import { db } from '../db/connection';

// Answers that change only when a published sheet changes (the speed map, change effects) are
// kept per process under the listing version (summary_version, moved on by every listing refresh
// in the change's own transaction, see derived/stat-summaries.ts). A read costs one primary-key
// lookup while nothing changed, and an answer is never older than the version it was kept under:
// a change committed while it was being read only makes the next read compute it again.

const MAX = 128;
const kept = new Map<string, { v: number; value: Promise<unknown> }>();

export async function listingVersion(): Promise<number> {
	const [row] = await db().query<{ v: number }>('SELECT v FROM summary_version WHERE id = 1', {
		type: QueryTypes.SELECT
	});
	return Number(row?.v ?? 0);
}

/** `make()`'s answer, computed once per listing version for `key` (a read in flight is shared). */
export async function whileUnchanged<T>(key: string, make: () => Promise<T>): Promise<T> {
	const v = await listingVersion();
	const hit = kept.get(key);
	if (hit && hit.v === v) {
		kept.delete(key);
		kept.set(key, hit);
		return hit.value as Promise<T>;
	}
	const value = make();
	const entry = { v, value };
	kept.delete(key);
	if (kept.size >= MAX) kept.delete(kept.keys().next().value!);
	kept.set(key, entry);
	// A failed read is not kept.
	value.catch(() => {
		if (kept.get(key) === entry) kept.delete(key);
	});
	return value;
}
