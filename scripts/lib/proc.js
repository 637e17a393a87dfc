// Child processes the launcher owns: spawn, remember by pid file, stop, and clean up after a crash.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';

export const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

export function alive(pid) {
	try {
		process.kill(pid, 0);
		return true;
	} catch {
		return false;
	}
}

export function cmdline(pid) {
	try {
		return fs.readFileSync(`/proc/${pid}/cmdline`, 'utf8').split('\0').join(' ');
	} catch {
		return '';
	}
}

export function readPid(file) {
	try {
		const pid = Number(fs.readFileSync(file, 'utf8').trim());
		return Number.isInteger(pid) && pid > 0 ? pid : null;
	} catch {
		return null;
	}
}

/** Stops a process recorded in `file` only if its command line still carries `signature`. */
export async function stopStale(file, signature, label) {
	const pid = readPid(file);
	if (pid && alive(pid) && cmdline(pid).includes(signature)) {
		console.log(`· stopping ${label} left over from an earlier run (pid ${pid})`);
		await stopPid(pid, 60_000);
	}
	fs.rmSync(file, { force: true });
}

export async function stopPid(pid, graceMs = 10_000) {
	if (!alive(pid)) return;
	try {
		process.kill(pid, 'SIGTERM');
	} catch {
		return;
	}
	const until = Date.now() + graceMs;
	while (alive(pid) && Date.now() < until) await sleep(100);
	if (alive(pid)) {
		try {
			process.kill(pid, 'SIGKILL');
		} catch {
			/* already gone */
		}
	}
}

export function portOpen(port, host = '127.0.0.1') {
	return new Promise((resolve) => {
		const s = net.connect({ port: Number(port), host });
		s.once('connect', () => {
			s.destroy();
			resolve(true);
		});
		s.once('error', () => resolve(false));
		s.setTimeout(1000, () => {
			s.destroy();
			resolve(false);
		});
	});
}

export async function waitForPort(port, ms, child) {
	const until = Date.now() + ms;
	while (Date.now() < until) {
		if (child && child.exitCode !== null) return false;
		if (await portOpen(port)) return true;
		await sleep(100);
	}
	return false;
}

/** Runs a command to completion with inherited output; resolves with its exit code. */
export function run(cmd, args, opts = {}) {
	return new Promise((resolve) => {
		const c = spawn(cmd, args, { stdio: 'inherit', ...opts });
		c.once('error', (err) => {
			console.error(`✗ could not run ${cmd}: ${err.message}`);
			resolve(127);
		});
		c.once('exit', (code, signal) => resolve(code ?? (signal ? 128 : 1)));
	});
}

/** Like run(), but drops output lines matching `drop` (third-party bundler chatter). */
export function runQuiet(cmd, args, drop, opts = {}) {
	return new Promise((resolve) => {
		const c = spawn(cmd, args, { ...opts, stdio: ['ignore', 'pipe', 'pipe'] });
		const pass = (stream, out) => {
			let buf = '';
			stream.on('data', (d) => {
				buf += d.toString();
				const lines = buf.split('\n');
				buf = lines.pop() ?? '';
				for (const l of lines) if (!drop.test(l)) out.write(l + '\n');
			});
			stream.on('end', () => buf && !drop.test(buf) && out.write(buf + '\n'));
		};
		pass(c.stdout, process.stdout);
		pass(c.stderr, process.stderr);
		c.once('error', () => resolve(127));
		c.once('exit', (code) => resolve(code ?? 1));
	});
}
