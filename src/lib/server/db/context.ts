import { AsyncLocalStorage } from 'node:async_hooks';
import type { Transaction } from 'sequelize';

/**
 * Sequelize's continuation-local transactions, kept by Node's own AsyncLocalStorage: inside
 * `inTransaction(fn)` every query — model calls and raw `query()` alike, in any module — joins
 * the transaction without being handed it. We chose this over passing `transaction` by hand
 * because a forgotten option there is silent: the write runs on another connection, outside the
 * rollback, and may wait on the transaction's own row locks. Sequelize asks for a namespace with
 * cls-hooked's shape (get, set, run, bind); this is that shape over AsyncLocalStorage, which Node
 * documents as the stable way to carry context (cls-hooked builds on `async_hooks.createHook`,
 * which Node's documentation discourages).
 */
const store = new AsyncLocalStorage<Map<string, unknown>>();

export const namespace = {
	get: (key: string) => store.getStore()?.get(key),
	set: (key: string, value: unknown) => {
		store.getStore()?.set(key, value);
		return value;
	},
	run: (fn: (context: Map<string, unknown>) => unknown) => {
		const context = new Map<string, unknown>();
		return store.run(context, () => fn(context));
	},
	bind: <F>(fn: F) => fn
};

/** The transaction this code runs in, if any. */
export const currentTransaction = (): Transaction | null =>
	(namespace.get('transaction') as Transaction | null | undefined) ?? null;

/**
 * Runs `fn` outside any transaction. Timers and background loops keep the context they were
 * started in, so one started while a transaction is open would otherwise send its queries there.
 */
export const detached = <T>(fn: () => T): T => store.exit(fn);
