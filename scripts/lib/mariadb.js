// A project-local MariaDB: own data folder, loopback only, never the system's port or config.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fail, which } from './install.js';
import { alive, portOpen, readPid, run, sleep, stopStale } from './proc.js';

const files = (dir) => ({
	data: path.join(dir, 'data'),
	socket: path.join(dir, 'mysqld.sock'),
	pid: path.join(dir, 'mysqld.pid'),
	log: path.join(dir, 'error.log')
});

/**
 * Starts (initialising when new) a MariaDB on `dir` and `port`: the stack's database by default;
 * `extra` adds server options (binary log, server id), `wipe` starts from an empty data folder,
 * `create` makes the database and its accounts. Returns its pid, a stop function and whether the
 * data folder was new.
 */
export async function startMariadb(
	e,
	{ dir = e.DB_DATA_DIR, port = e.DB_PORT, extra = [], wipe = false, create = true } = {}
) {
	const f = files(dir);
	if (wipe) {
		await stopStale(f.pid, `--datadir=${f.data}`, 'MariaDB');
		fs.rmSync(dir, { recursive: true, force: true });
	}
	fs.mkdirSync(dir, { recursive: true });
	// A server from an earlier run whose launcher died: ours if its command line names our data dir.
	await stopStale(f.pid, `--datadir=${f.data}`, 'MariaDB');
	fs.rmSync(f.socket, { force: true });
	if (await portOpen(port)) {
		fail(
			`port ${port} (MariaDB) is already in use by another program`,
			`Stop that program, or choose another port with DB_PORT=…`
		);
	}
	const fresh = !fs.existsSync(path.join(f.data, 'mysql'));
	if (fresh) {
		console.log('· initialising the MariaDB data folder…');
		fs.rmSync(f.data, { recursive: true, force: true });
		const code = await run(
			which('mariadb-install-db') ?? 'mariadb-install-db',
			[
				'--no-defaults',
				`--datadir=${f.data}`,
				'--auth-root-authentication-method=normal',
				'--skip-test-db',
				'--user=root'
			],
			{ stdio: ['ignore', 'ignore', 'inherit'] }
		);
		if (code !== 0) fail('mariadb-install-db failed', `See the messages above; data dir ${f.data}`);
	}
	const child = spawn(
		which('mariadbd') ?? 'mariadbd',
		[
			'--no-defaults',
			`--datadir=${f.data}`,
			`--socket=${f.socket}`,
			`--pid-file=${f.pid}`,
			`--port=${port}`,
			'--bind-address=127.0.0.1',
			'--skip-name-resolve',
			'--user=root',
			`--log-error=${f.log}`,
			// Room for the benchmark's 100,000 builds and their indexes (about 500 MB) in memory.
			'--innodb-buffer-pool-size=1G',
			'--max-connections=200',
			...extra
		],
		{ detached: true, stdio: 'ignore' }
	);
	const until = Date.now() + 60_000;
	while (Date.now() < until) {
		if (child.exitCode !== null) break;
		if (await ping(f.socket)) {
			if (create) await createDatabase(e, f.socket);
			return { pid: child.pid, socket: f.socket, fresh, stop: () => stopMariadb(dir) };
		}
		await sleep(150);
	}
	const tail = fs.existsSync(f.log)
		? fs.readFileSync(f.log, 'utf8').split('\n').slice(-8).join('\n')
		: '';
	fail('MariaDB did not start', `Its log (${f.log}) ends with:\n${tail}`);
}

async function ping(socket) {
	const code = await run(
		which('mariadb-admin') ?? 'mariadb-admin',
		['--no-defaults', `--socket=${socket}`, '-uroot', '--connect-timeout=1', 'ping'],
		{ stdio: 'ignore' }
	);
	return code === 0;
}

async function createDatabase(e, socket) {
	const q = (s) => s.replace(/[`'\\]/g, '');
	const [db, user, pw] = [q(e.DB_NAME), q(e.DB_USER), q(e.DB_PASSWORD)];
	const [owner, ownerPw] = [q(e.DB_OWNER_USER), q(e.DB_OWNER_PASSWORD)];
	const sql = [
		// The test stack starts every run from an empty database.
		...(e.FRESH_DB ? [`DROP DATABASE IF EXISTS \`${db}\``] : []),
		`CREATE DATABASE IF NOT EXISTS \`${db}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
		`CREATE USER IF NOT EXISTS '${owner}'@'127.0.0.1' IDENTIFIED BY '${ownerPw}'`,
		`ALTER USER '${owner}'@'127.0.0.1' IDENTIFIED BY '${ownerPw}'`,
		`GRANT ALL ON \`${db}\`.* TO '${owner}'@'127.0.0.1' WITH GRANT OPTION`,
		// The app's account: the migrations grant what it may do, table by table.
		`CREATE USER IF NOT EXISTS '${user}'@'127.0.0.1' IDENTIFIED BY '${pw}'`,
		`ALTER USER '${user}'@'127.0.0.1' IDENTIFIED BY '${pw}'`
	].join('; ');
	const code = await run(
		which('mariadb') ?? 'mariadb',
		['--no-defaults', `--socket=${socket}`, '-uroot', '-e', sql],
		{ stdio: ['ignore', 'ignore', 'inherit'] }
	);
	if (code !== 0) fail('could not create the database and its user', 'See the message above.');
}

/** Runs SQL as root over the server's socket. */
export async function rootSql(socket, sql) {
	const code = await run(
		which('mariadb') ?? 'mariadb',
		['--no-defaults', `--socket=${socket}`, '-uroot', '-e', sql],
		{ stdio: ['ignore', 'ignore', 'inherit'] }
	);
	return code === 0;
}

/** A clean shutdown: SIGTERM makes mariadbd flush and exit; wait for it. */
export async function stopMariadb(dir) {
	const f = files(dir);
	const pid = readPid(f.pid);
	if (!pid || !alive(pid)) return;
	process.kill(pid, 'SIGTERM');
	const until = Date.now() + 60_000;
	while (alive(pid) && Date.now() < until) await sleep(100);
	if (alive(pid)) process.kill(pid, 'SIGKILL');
}
