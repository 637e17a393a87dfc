import fs from 'node:fs';
import mariadb from 'mariadb';
import { Sequelize, Transaction } from 'sequelize';
import { env } from '../env';
import { namespace } from './context';
import { rethrowUnavailable } from './unavailable';

// Every query inside `inTransaction` joins it without being handed it (see context.ts).
Sequelize.useCLS(namespace);

let instance: Sequelize | null = null;

/** One Sequelize instance per process, created on first use. */
export function db(): Sequelize {
	if (instance) return instance;
	const e = env();
	instance = new Sequelize(e.DB_NAME, e.DB_USER, e.DB_PASSWORD, {
		host: e.DB_HOST,
		port: e.DB_PORT,
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
	reportOutages(instance);
	return instance;
}

/**
 * Every query and transaction goes through these two methods: a lost database comes out of them
 * as one 503 answer ("nothing was saved") instead of a generic fault on whichever page asked.
 */
function reportOutages(s: Sequelize) {
	const query = s.query.bind(s) as (...a: unknown[]) => Promise<unknown>;
	const transaction = s.transaction.bind(s) as (...a: unknown[]) => Promise<unknown>;
	Object.assign(s, {
		query: (...a: unknown[]) => query(...a).catch(rethrowUnavailable),
		transaction: (...a: unknown[]) => transaction(...a).catch(rethrowUnavailable)
	});
}

export async function closeDb(): Promise<void> {
	if (!instance) return;
	const s = instance;
	instance = null;
	await s.close();
}
