import fs from 'node:fs';
import mariadb from 'mariadb';
import { QueryTypes, Sequelize, Transaction } from 'sequelize';
import { env } from '../env';
import { currentTransaction, namespace } from './context';
import { BUMP_PUBLIC_VERSION, movesPublicPages } from './public-writes';
import { noteWrite, pauseReplica, READS, replicaUsable } from './replica';
import { isDatabaseDown, rethrowUnavailable } from './unavailable';

// Every query inside `inTransaction` joins it without being handed it (see context.ts).
Sequelize.useCLS(namespace);

let instance: Sequelize | null = null;

/** One Sequelize instance per process, created on first use. */
export function db(): Sequelize {
	if (instance) return instance;
	const e = env();
	const replica = replicaAddress();
	instance = new Sequelize(e.DB_NAME, e.DB_USER, e.DB_PASSWORD, {
		host: e.DB_HOST,
		port: e.DB_PORT,
		// With a replica, Sequelize keeps two pools: reads outside a transaction go to `read`.
		...(replica
			? { replication: { read: [replica], write: { host: e.DB_HOST, port: e.DB_PORT } } }
			: {}),
		dialect: 'mariadb',
		// Passing the driver module keeps Vite, vitest and the built server on the same pinned driver.
		dialectModule: mariadb,
		logging: false,
		pool: { max: 10, min: 0, idle: 10_000 },
		// Each change is one transaction; READ COMMITTED keeps InnoDB from taking gap locks on the
		// ranges a change scans (all of a build's setups), so two members saving different builds
		// never wait on, or deadlock with, each other. Rows a change writes are still locked.
		isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED,
		dialectOptions: {
			connectTimeout: 3_000,
			...(e.DB_TLS
				? {
						ssl: e.DB_TLS_CA
							? { ca: fs.readFileSync(e.DB_TLS_CA, 'utf8') }
							: { rejectUnauthorized: true }
					}
				: {})
		}
	});
	reportOutages(instance, replica !== null);
	return instance;
}

function replicaAddress(): { host: string; port: number } | null {
	const e = env();
	if (!e.DB_REPLICA_HOST && !e.DB_REPLICA_PORT) return null;
	return { host: e.DB_REPLICA_HOST ?? e.DB_HOST, port: e.DB_REPLICA_PORT ?? e.DB_PORT };
}

/** One trivial query on the primary: makes Sequelize learn the server's version now. */
export async function warmUp(): Promise<void> {
	await db().query('SELECT 1', { type: QueryTypes.SELECT, useMaster: true } as object);
}

/** Whether reads may go to a replica (see replica.ts). */
export const replicated = (): boolean => replicaAddress() !== null;

/**
 * Every query and transaction goes through these two methods: a lost database comes out of them
 * as one 503 answer ("nothing was saved") instead of a generic fault on whichever page asked.
 */
function reportOutages(s: Sequelize, withReplica: boolean) {
	const query = s.query.bind(s) as (sql: unknown, o?: QueryOptions) => Promise<unknown>;
	const transaction = s.transaction.bind(s) as (...a: unknown[]) => Promise<unknown>;
	const run = withReplica
		? (sql: unknown, o?: QueryOptions) => routed(query, sql, o)
		: (sql: unknown, o?: QueryOptions) => query(sql, o).catch(rethrowUnavailable);
	// Never fails the change it follows (that is committed): at worst kept answers live out their
	// age. Before its migration (a new database being migrated) there is nothing to move.
	const bump = () =>
		query(BUMP_PUBLIC_VERSION, { transaction: null }).catch((e: unknown) => {
			if (!/ER_NO_SUCH_TABLE/.test(String((e as { original?: { code?: string } }).original?.code)))
				console.error('[public version]', e);
		});
	Object.assign(s, {
		query: async (sql: unknown, o?: QueryOptions) => {
			const r = await run(sql, o);
			if (o?.type !== QueryTypes.SELECT && movesPublicPages(sqlText(sql)))
				await afterPublicChange(o, bump);
			return r;
		},
		transaction: (...a: unknown[]) =>
			transaction(...a).then((r) => {
				noteWrite();
				return r;
			}, rethrowUnavailable)
	});
}

const sqlText = (sql: unknown): string =>
	typeof sql === 'string' ? sql : ((sql as { query?: string })?.query ?? '');

const bumping = new WeakSet<Transaction>();

/**
 * A statement that may change a page moves `public_version` on once its change is committed:
 * at once outside a transaction, after the commit inside one (once per transaction). Moving it
 * after the commit, not inside the transaction, keeps writers from queueing on that one row; an
 * answer kept in between is at most as old as a read made just before the commit.
 */
async function afterPublicChange(o: QueryOptions | undefined, bump: () => Promise<unknown>) {
	const t = (o?.transaction !== undefined ? o.transaction : currentTransaction()) as
		Transaction | null | undefined;
	if (!t) {
		await bump();
		return;
	}
	if (bumping.has(t)) return;
	bumping.add(t);
	t.afterCommit(async () => {
		await bump();
	});
}

type QueryOptions = {
	type?: string;
	useMaster?: boolean;
	transaction?: unknown;
	/** Ours: ask the replica and nobody else (no fallback to the primary). */
	replicaOnly?: boolean;
};

/**
 * A read outside a transaction goes to the replica while it is usable; if the replica cannot be
 * reached it is set aside for a few seconds (DB_REPLICA_PAUSE_S) and the read is asked of the
 * primary instead, so a stopped replica shows no error. Anything else goes to the primary and, unless it only reads,
 * counts as this request's write (read-your-writes, replica.ts).
 */
async function routed(
	query: (sql: unknown, o?: QueryOptions) => Promise<unknown>,
	sql: unknown,
	o: QueryOptions = {}
): Promise<unknown> {
	const inTransaction = o.transaction ?? (o.transaction === undefined && currentTransaction());
	const isRead = o.type === QueryTypes.SELECT && !o.useMaster && !inTransaction;
	if (!isRead) {
		const r = await query(sql, o).catch(rethrowUnavailable);
		const text = sqlText(sql);
		if (o.type !== QueryTypes.SELECT && !(o.type === QueryTypes.RAW && READS.test(text)))
			noteWrite();
		return r;
	}
	if (o.replicaOnly) return query(sql, o);
	let triedReplica = false;
	// Twice: a connection the pool kept from before the replica restarted fails once, then the
	// pool opens a new one.
	for (let attempt = 0; attempt < 2 && replicaUsable(); attempt++) {
		triedReplica = true;
		try {
			return await query(sql, o);
		} catch (err) {
			if (!isDatabaseDown(err)) throw err;
			if (attempt === 1) pauseReplica(env().DB_REPLICA_PAUSE_S);
		}
	}
	try {
		return await query(sql, { ...o, useMaster: true });
	} catch (err) {
		// The primary is down too. The replica, set aside a moment ago or a little behind this
		// member, still answers better than an error: nothing can be written meanwhile anyway.
		if (!isDatabaseDown(err) || triedReplica) rethrowUnavailable(err);
		return query(sql, o).catch(rethrowUnavailable);
	}
}

/** The primary's binlog position now: at or past every write this request committed. */
export async function writtenPosition(): Promise<string | null> {
	const rows = (await db().query('SELECT @@gtid_binlog_pos AS pos', {
		type: QueryTypes.SELECT,
		useMaster: true
	} as object)) as { pos: string }[];
	return rows[0]?.pos || null;
}

/**
 * Waits up to `ms` for the replica to apply everything up to `position`. False when it did not
 * get there in time, or cannot be asked (then the caller reads from the primary).
 */
export async function replicaReached(
	position: string,
	ms: number,
	opts: { evenIfPaused?: boolean } = {}
): Promise<boolean> {
	if (!opts.evenIfPaused && !replicaUsable()) return false;
	try {
		const rows = (await db().query('SELECT MASTER_GTID_WAIT(?, ?) AS r', {
			type: QueryTypes.SELECT,
			replacements: [position, ms / 1000],
			replicaOnly: true
		} as object)) as { r: number | null }[];
		return Number(rows[0]?.r) === 0;
	} catch (err) {
		if (isDatabaseDown(err)) pauseReplica(env().DB_REPLICA_PAUSE_S);
		return false;
	}
}

export async function closeDb(): Promise<void> {
	if (!instance) return;
	const s = instance;
	instance = null;
	await s.close();
}
