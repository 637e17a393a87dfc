import type { Transaction } from 'sequelize';
import { db } from './connection';
import { currentTransaction } from './context';

const pending = new WeakMap<Transaction, (() => unknown)[]>();

/**
 * Runs `fn` in one transaction: a new one, or the caller's when there is one (so a service may
 * call another service and both commit or roll back together). A throw rolls everything back.
 * Every query inside joins it without being handed it (see `context.ts`).
 */
export async function inTransaction<T>(fn: (t: Transaction) => Promise<T>): Promise<T> {
	const open = currentTransaction();
	if (open) return fn(open);
	let opened: Transaction | null = null;
	const result = await db().transaction((t) => {
		opened = t;
		return fn(t);
	});
	// Only after a commit that succeeded (Sequelize's own afterCommit also runs after a failed one).
	for (const job of pending.get(opened!) ?? []) await runQuietly(job);
	return result;
}

/**
 * Work that must wait until the change is committed (deleting objects from the store): queued
 * until the outermost transaction commits, dropped if it rolls back, run now outside one.
 */
export async function afterCommit(job: () => unknown): Promise<void> {
	const t = currentTransaction();
	if (!t) return runQuietly(job);
	const list = pending.get(t) ?? [];
	list.push(job);
	pending.set(t, list);
}

async function runQuietly(job: () => unknown) {
	try {
		await job();
	} catch (e) {
		console.error('after-commit work failed:', e);
	}
}
