import { QueryTypes, type QueryInterface } from 'sequelize';
import { env } from '../env';

/**
 * Tables the app may only read and append to. The moderation log is evidence: once written, a
 * bug or a stolen app password must not be able to change or erase it, so the database itself
 * refuses UPDATE and DELETE to the app's account.
 */
export const APPEND_ONLY = ['moderation_log'] as const;

const ident = (s: string) => `\`${s.replace(/`/g, '')}\``;
const literal = (s: string) => `'${s.replace(/['\\]/g, '')}'`;

/**
 * Gives the app's account SELECT and INSERT on the whole database, and UPDATE and DELETE table by
 * table on every table except the append-only ones. Table-level grants are the only way to leave
 * one table out (MariaDB privileges only add up), so this runs again after every migration and
 * picks up new tables. It runs as the owner account, which holds GRANT OPTION.
 */
export async function applyAppGrants(q: QueryInterface): Promise<void> {
	const e = env();
	const app = e.DB_APP_USER;
	if (!app || app === e.DB_USER)
		throw new Error(
			'Migrations run as the owner account (DB_USER) and set the grants of the app account (DB_APP_USER); the two must differ.'
		);
	const who = `${literal(app)}@${literal(e.DB_APP_HOST)}`;
	const dbName = ident(e.DB_NAME);
	const s = q.sequelize;
	// Reading another account's grants needs the mysql schema, which the owner lacks; so revoke
	// blindly and let "there was no such grant" pass. An older launcher gave the account ALL.
	const revoke = (on: string) =>
		s.query(`REVOKE ALL PRIVILEGES ON ${on} FROM ${who}`).catch((err: unknown) => {
			if (!/1141|1147|no such grant/i.test(String(err))) throw err;
		});
	const tables = await s.query<{ name: string }>(
		`SELECT table_name AS name FROM information_schema.tables
		 WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE'`,
		{ type: QueryTypes.SELECT }
	);
	await revoke(`${dbName}.*`);
	for (const { name } of tables) await revoke(`${dbName}.${ident(name)}`);
	await s.query(`GRANT SELECT, INSERT ON ${dbName}.* TO ${who}`);
	for (const { name } of tables) {
		if ((APPEND_ONLY as readonly string[]).includes(name) || name === 'schema_migrations') continue;
		await s.query(`GRANT UPDATE, DELETE ON ${dbName}.${ident(name)} TO ${who}`);
	}
}
