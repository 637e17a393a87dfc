import mariadb from 'mariadb';
import { Sequelize } from 'sequelize';
import { env } from '../env';

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
		dialectOptions: { connectTimeout: 3_000 }
	});
	return instance;
}

export async function closeDb(): Promise<void> {
	if (!instance) return;
	const s = instance;
	instance = null;
	await s.close();
}
