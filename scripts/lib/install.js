// Installs what a fresh Debian machine lacks: npm packages from the lock file, and Debian packages.
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { run } from './proc.js';
import { ROOT } from './profiles.js';

const STAMP = path.join(ROOT, 'node_modules', '.squishline-lock-hash');

export async function ensureNodeModules() {
	const lock = fs.readFileSync(path.join(ROOT, 'package-lock.json'));
	const hash = createHash('sha256').update(lock).digest('hex');
	const current = fs.existsSync(STAMP) ? fs.readFileSync(STAMP, 'utf8').trim() : '';
	if (current === hash) return;
	console.log('· installing npm packages (npm ci)…');
	const code = await run('npm', ['ci', '--include=dev', '--no-audit', '--no-fund'], { cwd: ROOT });
	if (code !== 0) fail('npm ci failed', 'Check the network to the npm registry and run again.');
	fs.writeFileSync(STAMP, hash + '\n');
}

export function which(bin, extra = ['/usr/sbin', '/usr/bin', '/sbin', '/usr/local/bin']) {
	const dirs = [...(process.env.PATH ?? '').split(':'), ...extra];
	for (const d of dirs) {
		const p = path.join(d, bin);
		try {
			fs.accessSync(p, fs.constants.X_OK);
			return p;
		} catch {
			/* keep looking */
		}
	}
	return null;
}

let aptUpdated = false;

/** apt-get installs the Debian packages whose binaries are missing. */
export async function ensureDebianPackages(wanted) {
	const missing = wanted
		.filter((w) => (w.file ? !fs.existsSync(w.file) : !which(w.bin)))
		.map((w) => w.pkg);
	if (missing.length === 0) return;
	if (process.getuid?.() !== 0) {
		fail(
			`missing Debian packages: ${missing.join(', ')}`,
			`Install them with: sudo apt-get install -y ${missing.join(' ')}`
		);
	}
	const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
	if (!aptUpdated) {
		console.log('· apt-get update…');
		if ((await run('apt-get', ['update', '-qq'], { env })) !== 0)
			fail('apt-get update failed', 'Check the network to the Debian mirrors.');
		aptUpdated = true;
	}
	console.log(`· installing ${missing.join(', ')} with apt-get…`);
	const code = await run('apt-get', ['install', '-y', '-qq', ...missing], { env });
	if (code !== 0) fail(`apt-get install ${missing.join(' ')} failed`, 'See the output above.');
}

export function fail(what, fix) {
	console.error(`\n✗ ${what}\n  ${fix}\n`);
	process.exit(1);
}
