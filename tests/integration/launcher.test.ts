import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import mariadb from 'mariadb';
import { afterAll, describe, expect, it } from 'vitest';
import { launch } from '../support/launcher';

// Runs the real launcher (`npm run services` mode) on ports and folders of its own, so this
// test does not disturb the stack the rest of `npm test` is using.
const root = path.resolve(import.meta.dirname, '../..');
const base = path.join(root, '.data/launcher-test');
const env: NodeJS.ProcessEnv = {
	...process.env,
	STACK_PROFILE: 'test',
	KEEP_TEST_DB: '1',
	PORT: '3190',
	DB_PORT: '3327',
	S3_PORT: '4589',
	SMTP_PORT: '2545',
	DB_NAME: 'squishline_launcher',
	DB_DATA_DIR: path.join(base, 'mariadb'),
	S3_DATA_DIR: path.join(base, 's3'),
	FAKE_MAIL_DIR: path.join(base, 'outbox'),
	RUN_DIR: path.join(base, 'run'),
	S3_ENDPOINT: undefined,
	SMTP_URL: undefined,
	ORIGIN: undefined
};

type Ready = { launcher: number; children: { name: string; pid: number }[] };
const running: ChildProcess[] = [];

function startLauncher(): Promise<{ child: ChildProcess; ready: Ready }> {
	return launch<Ready>('services', env, 'STACK READY', 90_000, (child) => running.push(child));
}

const alive = (pid: number) => {
	try {
		process.kill(pid, 0);
		return true;
	} catch {
		return false;
	}
};

async function waitGone(pids: number[], ms: number) {
	const until = Date.now() + ms;
	while (pids.some(alive) && Date.now() < until) await new Promise((r) => setTimeout(r, 100));
	return pids.filter(alive);
}

async function counts() {
	const conn = await mariadb.createConnection({
		host: '127.0.0.1',
		port: 3327,
		user: env.DB_USER ?? 'squishline',
		password: env.DB_PASSWORD ?? 'squishline-local',
		database: 'squishline_launcher'
	});
	try {
		const [u] = await conn.query('SELECT COUNT(*) AS n FROM users');
		const [m] = await conn.query('SELECT COUNT(*) AS n FROM schema_migrations');
		return { users: Number(u.n), migrations: Number(m.n) };
	} finally {
		await conn.end();
	}
}

function seedAgain(): Promise<number> {
	return new Promise((resolve) => {
		const c = spawn(process.execPath, ['--import', 'tsx', 'scripts/seed.ts'], {
			cwd: root,
			env: { ...env, DB_PORT: '3327', DB_HOST: '127.0.0.1' },
			stdio: 'ignore'
		});
		c.once('exit', (code) => resolve(code ?? 1));
	});
}

afterAll(async () => {
	for (const c of running) if (c.exitCode === null) c.kill('SIGINT');
	await waitGone(running.map((c) => c.pid!).filter(Boolean), 30_000);
});

describe('the stack launcher', { timeout: 240_000 }, () => {
	it('starts from nothing, seeds idempotently, and SIGINT stops every child', async () => {
		fs.rmSync(base, { recursive: true, force: true });
		const { child, ready } = await startLauncher();
		expect(ready.children.map((c) => c.name)).toEqual(['mariadb', 's3', 'smtp']);
		const first = await counts();
		expect(first.users).toBeGreaterThanOrEqual(22);
		expect(await seedAgain()).toBe(0);
		expect(await counts()).toEqual(first);

		child.kill('SIGINT');
		await new Promise((r) => child.once('exit', r));
		expect(child.exitCode).toBe(0);
		expect(
			await waitGone(
				ready.children.map((c) => c.pid),
				5_000
			)
		).toEqual([]);
	});

	it('starts again after kill -9 of the launcher and its database, with the data intact', async () => {
		const before = await (async () => {
			const { child, ready } = await startLauncher();
			const c = await counts();
			const db = ready.children.find((x) => x.name === 'mariadb')!.pid;
			process.kill(ready.launcher, 'SIGKILL');
			process.kill(db, 'SIGKILL');
			await new Promise((r) => child.once('exit', r));
			// The fakes notice their launcher is gone and exit by themselves.
			expect(
				await waitGone(
					ready.children.map((x) => x.pid),
					10_000
				)
			).toEqual([]);
			return c;
		})();
		expect(fs.existsSync(path.join(base, 'run', 'launcher.pid'))).toBe(true); // left stale by kill -9

		const { child, ready } = await startLauncher();
		expect(await counts()).toEqual(before);
		child.kill('SIGINT');
		await new Promise((r) => child.once('exit', r));
		expect(
			await waitGone(
				ready.children.map((c) => c.pid),
				5_000
			)
		).toEqual([]);
		expect(fs.existsSync(path.join(base, 'run', 'launcher.pid'))).toBe(false);
	});
});
