import { spawn, type ChildProcess } from 'node:child_process';
import { launch } from '../support/launcher';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import mariadb from 'mariadb';
import { STACK_KEYS, stackEnv } from '../../scripts/lib/profiles.js';

// The cluster the fault tests run against: the real launcher (`npm run serve:cluster`) in its
// test profile (own ports and folders, empty databases, the test run's build), with nginx in front
// of two app processes, a primary and a replica.

export const root = path.resolve(import.meta.dirname, '../..');
export const settings = stackEnv('cluster-test', {});
/** One secret for every process of the cluster and for this test process. */
const SECRET = randomBytes(32).toString('base64url');

export type Ready = {
	launcher: number;
	origin: string;
	apps: { pid: number; port: number }[];
	nginx: number;
	primary: number;
	replica: number;
};

/** Points this test process's own database code at the cluster's primary (never the replica). */
export function useClusterDatabase() {
	for (const k of ['DB_PORT', 'DB_NAME', 'DB_USER', 'DB_PASSWORD', 'SMTP_URL', 'FAKE_MAIL_DIR'])
		process.env[k] = settings[k];
	process.env.S3_ENDPOINT = settings.S3_ENDPOINT;
	process.env.SQUISHLINE_DEMO = '1';
	// The cluster's secret (signed mail links are checked against it).
	process.env.AUTH_SECRET = SECRET;
	delete process.env.DB_REPLICA_HOST;
	delete process.env.DB_REPLICA_PORT;
}

export async function startCluster(): Promise<{ child: ChildProcess; ready: Ready }> {
	const env: NodeJS.ProcessEnv = Object.fromEntries(
		Object.entries(process.env).filter(([k]) => !STACK_KEYS.includes(k))
	);
	env.STACK_PROFILE = 'cluster-test';
	env.AUTH_SECRET = SECRET;
	// Everything the cluster prints goes to a file, for reading after a failure.
	fs.mkdirSync(settings.RUN_DIR, { recursive: true });
	const log = fs.createWriteStream(path.join(settings.RUN_DIR, 'cluster.log'));
	return launch<Ready>('cluster', env, 'CLUSTER READY', 150_000, (child) => {
		child.stdout!.pipe(log);
		child.stderr!.pipe(log);
	});
}

export async function stopCluster(child: ChildProcess) {
	if (child.exitCode !== null) return;
	const gone = new Promise((r) => child.once('exit', r));
	child.kill('SIGTERM');
	await Promise.race([gone, new Promise((r) => setTimeout(r, 60_000))]);
}

export const alive = (pid: number) => {
	try {
		process.kill(pid, 0);
		return true;
	} catch {
		return false;
	}
};

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export async function until<T>(what: string, fn: () => Promise<T | null | false>, ms = 20_000) {
	const end = Date.now() + ms;
	let last: unknown;
	while (Date.now() < end) {
		try {
			const v = await fn();
			if (v) return v;
		} catch (e) {
			last = e;
		}
		await sleep(100);
	}
	throw new Error(`${what}: not within ${ms} ms${last ? ` (${String(last)})` : ''}`);
}

/** A MariaDB server of the cluster, stopped and started again as its launcher started it. */
export class Server {
	private argv: string[] = [];
	constructor(
		readonly dir: string,
		public pid: number
	) {}
	socket = () => path.join(this.dir, 'mysqld.sock');

	async sql<T = Record<string, unknown>>(text: string): Promise<T[]> {
		const conn = await mariadb.createConnection({ socketPath: this.socket(), user: 'root' });
		try {
			return (await conn.query({ sql: text, bigIntAsNumber: true })) as T[];
		} finally {
			await conn.end();
		}
	}

	async stop() {
		this.argv = fs.readFileSync(`/proc/${this.pid}/cmdline`, 'utf8').split('\0').filter(Boolean);
		process.kill(this.pid, 'SIGTERM');
		await until('the server stops', async () => !alive(this.pid), 60_000);
	}

	async start() {
		const [bin, ...args] = this.argv;
		const child = spawn(bin, args, { detached: true, stdio: 'ignore' });
		child.unref();
		this.pid = child.pid!;
		await until('the server answers', () => this.sql('SELECT 1').then(() => true), 60_000);
	}
}
