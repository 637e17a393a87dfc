#!/usr/bin/env node
// The stack launcher behind `npm start`, `npm test`, `npm run dev` and `npm run services`.
// Plain JavaScript on purpose: on a fresh clone it runs before anything is installed.
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { ensureDebianPackages, ensureNodeModules, fail } from './lib/install.js';
import { startMariadb } from './lib/mariadb.js';
import {
	alive,
	cmdline,
	portOpen,
	readPid,
	run,
	stopPid,
	stopStale,
	waitForPort
} from './lib/proc.js';
import { ownerEnv, ROOT, stackEnv } from './lib/profiles.js';

const mode = process.argv[2] ?? 'start';
if (!['start', 'test', 'dev', 'services', 'perf'].includes(mode))
	fail(`unknown mode ${mode}`, 'Use start, test, dev, services or perf.');
const profile =
	mode === 'test' ? 'test' : mode === 'perf' ? 'perf' : (process.env.STACK_PROFILE ?? 'app');
const e = stackEnv(profile);
const children = []; // { name, pid, stop }
let stopping = false;

process.on('SIGINT', () => void shutdown(0));
process.on('SIGTERM', () => void shutdown(0));

await ensureNodeModules();
if (mode === 'test') {
	console.log('\n▸ checks: prettier, eslint, svelte-check');
	if ((await run('npm', ['run', '--silent', 'check'], { cwd: ROOT })) !== 0)
		fail('npm run check failed', 'Fix the problems listed above (npm run format fixes layout).');
}
await ensureDebianPackages([
	{ bin: 'mariadbd', pkg: 'mariadb-server' },
	...(mode === 'test' || mode === 'perf' ? [{ bin: 'chromium', pkg: 'chromium' }] : [])
]);

fs.mkdirSync(e.RUN_DIR, { recursive: true });
takeLock();
await cleanUpAfterCrash();
const env = { ...process.env, ...e, AUTH_SECRET: process.env.AUTH_SECRET ?? secret() };
const asOwner = ownerEnv(env);

console.log(`\n▸ services (${profile})`);
const dbServer = await startMariadb(e);
children.push({ name: 'mariadb', ...dbServer });
console.log(`· MariaDB on 127.0.0.1:${e.DB_PORT}, database ${e.DB_NAME}`);
if (mode === 'perf') {
	await tsx('scripts/migrate.ts', 'migrations');
	// The HTTP stage serves the production build through the production entry.
	await build();
	console.log('\n▸ benchmark');
	const code = await run(
		process.execPath,
		['--import', 'tsx', 'tests/perf/bench.ts', ...process.argv.slice(3)],
		{ cwd: ROOT, env: asOwner }
	);
	await shutdown(code);
}
await startNode('s3', ['fake-storage/s3.js'], e.S3_PORT, 'fake object store');
await startNode('smtp', ['fake-storage/smtp.js'], e.SMTP_PORT, 'fake mail server');

await tsx('scripts/migrate.ts', 'migrations');
await tsx('scripts/seed.ts', 'demo data');

if (mode === 'services') {
	console.log(
		`STACK READY ${JSON.stringify({ launcher: process.pid, children: children.map((c) => ({ name: c.name, pid: c.pid })) })}`
	);
} else if (mode === 'dev') {
	await startNode(
		'vite',
		['node_modules/vite/bin/vite.js', 'dev', '--port', e.PORT, '--strictPort'],
		e.PORT,
		'Vite dev server',
		120_000
	);
	announce();
} else if (mode === 'start') {
	await build();
	await startNode('app', ['scripts/serve.js'], e.PORT, 'app', 60_000);
	announce();
} else {
	await shutdown(await runTests());
}

async function runTests() {
	const { runSuites } = await import('./lib/suites.js');
	return runSuites({
		env,
		build,
		startApp: () => startNode('app', ['scripts/serve.js'], e.PORT, 'app', 60_000)
	});
}

async function build() {
	console.log('\n▸ building the app');
	const code = await run(
		process.execPath,
		['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn'],
		{ cwd: ROOT, env }
	);
	if (code !== 0) {
		console.error('✗ the build failed (see above)');
		await shutdown(1);
	}
}

async function tsx(script, label) {
	console.log(`· ${label}…`);
	const code = await run(process.execPath, ['--import', 'tsx', script], {
		cwd: ROOT,
		env: asOwner
	});
	if (code !== 0) {
		console.error(`✗ ${label} failed (see above)`);
		await shutdown(1);
	}
}

async function startNode(name, args, port, label, ms = 20_000) {
	if (await portOpen(port)) {
		console.error(
			`✗ port ${port} (${label}) is already in use by another program. Stop it or pick another port in the environment.`
		);
		await shutdown(1);
	}
	const child = spawn(process.execPath, args, {
		cwd: ROOT,
		env,
		detached: true,
		stdio: ['ignore', 'inherit', 'inherit']
	});
	const pidFile = path.join(e.RUN_DIR, `${name}.pid`);
	fs.writeFileSync(pidFile, String(child.pid));
	const entry = { name, pid: child.pid, stop: () => stopPid(child.pid) };
	children.push(entry);
	child.once('exit', (code) => {
		fs.rmSync(pidFile, { force: true });
		if (!stopping) {
			console.error(`✗ ${label} stopped unexpectedly (exit ${code})`);
			void shutdown(1);
		}
	});
	if (!(await waitForPort(port, ms, child))) {
		console.error(`✗ ${label} did not start listening on port ${port}`);
		await shutdown(1);
	}
	return entry;
}

function takeLock() {
	const lock = path.join(e.RUN_DIR, 'launcher.pid');
	const pid = readPid(lock);
	if (pid && pid !== process.pid && alive(pid) && cmdline(pid).includes('scripts/stack.js')) {
		fail(
			`this stack (${profile}) is already running, launcher pid ${pid}`,
			`Use it at ${e.ORIGIN}, or stop it with Ctrl-C (or kill ${pid}) first.`
		);
	}
	fs.writeFileSync(lock, String(process.pid));
}

/** After a crash or kill -9, stop what an earlier launcher of this stack left running. */
async function cleanUpAfterCrash() {
	await stopStale(path.join(e.RUN_DIR, 'app.pid'), 'scripts/serve.js', 'app server');
	await stopStale(path.join(e.RUN_DIR, 'vite.pid'), 'vite.js', 'Vite dev server');
	await stopStale(path.join(e.RUN_DIR, 's3.pid'), 'fake-storage/s3.js', 'fake object store');
	await stopStale(path.join(e.RUN_DIR, 'smtp.pid'), 'fake-storage/smtp.js', 'fake mail server');
}

function secret() {
	const file = path.join(e.RUN_DIR, '..', `${profile}-auth-secret`);
	if (!fs.existsSync(file))
		fs.writeFileSync(file, randomBytes(32).toString('base64url'), { mode: 0o600 });
	return fs.readFileSync(file, 'utf8').trim();
}

function announce() {
	console.log(`\n  Squishline DEMO is up: ${e.ORIGIN}`);
	console.log(
		'  This is the local demo: invented data, demo accounts whose passwords are printed below,\n' +
			'  fake mail and storage, and a public outbox page. Never put it on the internet; to run\n' +
			'  Squishline for real, see README.md, "Running in production" (npm run serve).'
	);
	const demo = JSON.parse(
		fs.readFileSync(path.join(ROOT, 'scripts', 'demo', 'people.json'), 'utf8')
	);
	console.log('  Demo accounts (role · e-mail · password):');
	for (const p of demo.people)
		console.log(`    ${p.role.padEnd(9)} ${p.email.padEnd(34)} ${demo.passwords[p.role]}`);
	if (e.FAKE_MAIL_DIR) console.log(`  Mail sent by the app: ${e.ORIGIN}/dev/outbox`);
	console.log('  Ctrl-C stops everything; the data stays for next time.\n');
}

async function shutdown(code) {
	if (stopping) return;
	stopping = true;
	for (const c of [...children].reverse()) {
		try {
			await c.stop();
		} catch {
			/* keep stopping the rest */
		}
	}
	fs.rmSync(path.join(e.RUN_DIR, 'launcher.pid'), { force: true });
	process.exit(code);
}
