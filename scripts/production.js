#!/usr/bin/env node
// `npm run serve`: Squishline for real. No fakes, no demo data, no outbox: it checks its settings,
// that the app is built and that the database schema is current, then serves. Run it under a
// process manager (README, "Running in production"); it never installs or seeds anything.
import fs from 'node:fs';
import path from 'node:path';
import { productionEnv, productionProblems } from './lib/settings.js';
import { serveBuild } from './lib/http-server.js';
import { ROOT } from './lib/profiles.js';

function refuse(lines) {
	console.error('✗ Squishline did not start (production):');
	for (const l of lines) console.error(`  - ${l}`);
	console.error('  See README.md, "Running in production". For the local demo, use npm start.');
	process.exit(1);
}

const problems = productionProblems(process.env);
if (problems.length) refuse(problems);

const env = productionEnv(process.env);
const buildDir = path.resolve(ROOT, env.BUILD_DIR ?? 'build');
if (!fs.existsSync(path.join(buildDir, 'index.js')))
	refuse([`there is no built app in ${buildDir}: run npm run build first.`]);

const pending = await pendingMigrations(env);
if (pending.error) refuse([`the database did not answer: ${pending.error}`]);
if (pending.names.length)
	refuse([
		`the database schema is ${pending.names.length} migration(s) behind (${pending.names[0]} first): run npm run migrate as the owner account.`
	]);

Object.assign(process.env, env);
// adapter-node closes the server on SIGTERM/SIGINT and the app lets go of the database; should
// anything still hold the process, it ends anyway once in-flight requests had their time.
for (const signal of ['SIGTERM', 'SIGINT'])
	process.once(signal, () => setTimeout(() => process.exit(0), 20_000).unref());
for (const k of ['SQUISHLINE_DEMO', 'FAKE_MAIL_DIR']) delete process.env[k];
console.log(`Squishline (production) on ${env.HOST}:${env.PORT}, serving ${env.ORIGIN}`);
await serveBuild(buildDir);

/** Migration files in the source that the database has not recorded as applied. */
async function pendingMigrations(e) {
	const dir = path.join(ROOT, 'src/lib/server/db/migrations');
	const names = fs
		.readdirSync(dir)
		.filter((n) => n.endsWith('.ts'))
		.map((n) => n.replace(/\.ts$/, ''))
		.sort();
	const { default: mariadb } = await import('mariadb');
	let conn;
	try {
		conn = await mariadb.createConnection({
			host: e.DB_HOST,
			port: Number(e.DB_PORT),
			user: e.DB_USER,
			password: e.DB_PASSWORD,
			database: e.DB_NAME,
			connectTimeout: 5000,
			...(e.DB_TLS === 'true'
				? { ssl: e.DB_TLS_CA ? { ca: fs.readFileSync(e.DB_TLS_CA, 'utf8') } : true }
				: {})
		});
		const rows = await conn.query('SELECT name FROM schema_migrations');
		const done = new Set(rows.map((r) => r.name));
		return { names: names.filter((n) => !done.has(n)) };
	} catch (err) {
		if (err?.code === 'ER_NO_SUCH_TABLE') return { names };
		return { names: [], error: err?.message ?? String(err) };
	} finally {
		await conn?.end().catch(() => {});
	}
}
