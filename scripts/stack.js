#!/usr/bin/env node
// The stack launcher behind `npm start`, `npm test`, `npm run dev` and `npm run services`.
// Plain JavaScript on purpose: on a fresh clone it runs before anything is installed.
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { ensureDebianPackages, ensureNodeModules, fail } from './lib/install.js';
import { startMariadb } from './lib/mariadb.js';
import { startNginx } from './lib/nginx.js';
import { startPrimary, startReplica } from './lib/replication.js';
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
const NGINX_PACKAGES = [
	{ bin: 'nginx', pkg: 'nginx-light' },
	{
		file: '/usr/lib/nginx/modules/ngx_http_brotli_filter_module.so',
		pkg: 'libnginx-mod-http-brotli-filter'
	},
	{
		file: '/usr/lib/nginx/modules/ngx_http_brotli_static_module.so',
		pkg: 'libnginx-mod-http-brotli-static'
	}
];
if (!['start', 'test', 'dev', 'services', 'perf', 'cluster'].includes(mode))
	fail(`unknown mode ${mode}`, 'Use start, test, dev, services, perf or cluster.');
const profile =
	mode === 'test'
		? 'test'
		: mode === 'perf'
			? 'perf'
			: mode === 'cluster'
				? process.env.STACK_PROFILE === 'cluster-test'
					? 'cluster-test'
					: 'cluster'
				: (process.env.STACK_PROFILE ?? 'app');
const e = stackEnv(profile);
const children = []; // { name, pid, stop }
let stopping = false;

process.on('SIGINT', () => void shutdown(0));
process.on('SIGTERM', () => void shutdown(0));

await ensureNodeModules();
// The checks (prettier, eslint, svelte-check) run beside everything else; their result and, if
// they fail, their output come with the summary at the end.
const checks = mode === 'test' ? startChecks() : null;
await ensureDebianPackages([
	{ bin: 'mariadbd', pkg: 'mariadb-server' },
	...(mode === 'test' || mode === 'perf' ? [{ bin: 'chromium', pkg: 'chromium' }] : []),
	// The edge of the cluster (the test run starts one for its fault tests).
	...(mode === 'test' || mode === 'perf' || mode === 'cluster' ? NGINX_PACKAGES : [])
]);

fs.mkdirSync(e.RUN_DIR, { recursive: true });
takeLock();
await cleanUpAfterCrash();
const env = { ...process.env, ...e, AUTH_SECRET: process.env.AUTH_SECRET ?? secret() };
const asOwner = ownerEnv(env);

console.log(`\n▸ services (${profile})`);
if (mode === 'cluster') {
	const primary = await startPrimary(e);
	children.push({ name: 'mariadb', ...primary });
	console.log(`· MariaDB primary on 127.0.0.1:${e.DB_PORT}, database ${e.DB_NAME}`);
	const replica = await startReplica(e, primary);
	children.push({ name: 'replica', ...replica });
	console.log(`· MariaDB replica on 127.0.0.1:${e.DB_REPLICA_PORT} (GTID replication)`);
} else {
	const dbServer = await startMariadb(e);
	children.push({ name: 'mariadb', ...dbServer });
	console.log(`· MariaDB on 127.0.0.1:${e.DB_PORT}, database ${e.DB_NAME}`);
}
if (mode === 'perf') {
	await tsx('scripts/migrate.ts', 'migrations');
	// The HTTP stage serves the production build through the production entry (the test run's
	// smoke run lends it the build it has just made).
	if (process.env.PERF_REUSE_BUILD !== '1' || !fs.existsSync(path.join(e.BUILD_DIR, 'index.js')))
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
// The fault tests bring their own data.
if (profile !== 'cluster-test') await tsx('scripts/seed.ts', 'demo data');

if (mode === 'cluster') {
	if (profile !== 'cluster-test' || !fs.existsSync(path.join(e.BUILD_DIR, 'index.js')))
		await build();
	const count = Math.max(1, Number(e.APP_PROCESSES) || 2);
	const ports = Array.from({ length: count }, (_, i) => Number(e.APP_PORT) + i);
	const apps = [];
	for (const [i, port] of ports.entries())
		apps.push(
			await startNode(`app${i + 1}`, ['scripts/serve.js'], port, `app process ${i + 1}`, 60_000, {
				env: { ...env, PORT: String(port) },
				// One process may stop (the fault tests kill one): nginx routes to the others.
				fatal: false
			})
		);
	const edge = await startNginx(e, ports);
	children.push({ name: 'nginx', ...edge });
	console.log(
		`CLUSTER READY ${JSON.stringify({
			launcher: process.pid,
			origin: e.ORIGIN,
			apps: apps.map((a, i) => ({ pid: a.pid, port: ports[i] })),
			nginx: edge.pid,
			primary: children.find((c) => c.name === 'mariadb').pid,
			replica: children.find((c) => c.name === 'replica').pid
		})}`
	);
	announce(`nginx in front of ${count} app processes, a primary MariaDB and a replica`);
} else if (mode === 'services') {
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
		checks,
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

async function startNode(name, args, port, label, ms = 20_000, opts = {}) {
	if (await portOpen(port)) {
		console.error(
			`✗ port ${port} (${label}) is already in use by another program. Stop it or pick another port in the environment.`
		);
		await shutdown(1);
	}
	const child = spawn(process.execPath, args, {
		cwd: ROOT,
		env: opts.env ?? env,
		detached: true,
		stdio: ['ignore', 'inherit', 'inherit']
	});
	const pidFile = path.join(e.RUN_DIR, `${name}.pid`);
	fs.writeFileSync(pidFile, String(child.pid));
	const entry = { name, pid: child.pid, stop: () => stopPid(child.pid) };
	children.push(entry);
	child.once('exit', (code) => {
		fs.rmSync(pidFile, { force: true });
		if (!stopping && opts.fatal === false) {
			console.error(`! ${label} stopped (exit ${code}); the others go on`);
		} else if (!stopping) {
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

function startChecks() {
	console.log('\n▸ checks (prettier, eslint, svelte-check) started beside the rest');
	const log = path.join(ROOT, '.data', 'checks.log');
	fs.mkdirSync(path.dirname(log), { recursive: true });
	const out = fs.openSync(log, 'w');
	const child = spawn('npm', ['run', '--silent', 'check'], {
		cwd: ROOT,
		stdio: ['ignore', out, out]
	});
	return new Promise((resolve) => {
		child.once('error', () => resolve({ code: 127, log }));
		child.once('exit', (code) => {
			fs.closeSync(out);
			resolve({ code: code ?? 1, log });
		});
	});
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
	for (let i = 1; i <= 8; i++)
		await stopStale(path.join(e.RUN_DIR, `app${i}.pid`), 'scripts/serve.js', 'app process');
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

function announce(what = '') {
	console.log(`\n  Squishline DEMO is up: ${e.ORIGIN}${what ? ` (${what})` : ''}`);
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
