import http from 'node:http';
import { afterAll, describe, expect, it } from 'vitest';
import { productionSettings as settingsOn, runEntry, type Entry } from './support/app';

// `npm run serve` (scripts/production.js) against the test stack's own MariaDB, object store and
// mail server, on a port of its own. It runs after the test build (scripts/lib/suites.js).
const PORT = 3196;
const ORIGIN = `http://127.0.0.1:${PORT}`;
const productionSettings = (): Record<string, string> => ({
	...settingsOn(PORT),
	AUTH_SECRET: 'x'.repeat(48)
});

const REQUIRED = [
	'AUTH_SECRET',
	'ORIGIN',
	'DB_HOST',
	'DB_NAME',
	'DB_USER',
	'DB_PASSWORD',
	'S3_ENDPOINT',
	'S3_BUCKET',
	'S3_REGION',
	'S3_ACCESS_KEY_ID',
	'S3_SECRET_ACCESS_KEY',
	'SMTP_URL',
	'MAIL_FROM'
];

const started: Entry[] = [];
afterAll(() => {
	for (const s of started) s.child.kill('SIGTERM');
});

describe('the production entry refuses to start without its settings', () => {
	it('names every missing setting at once', async () => {
		const { exited, output } = runEntry({ PATH: process.env.PATH ?? '' });
		expect(await exited).toBe(1);
		for (const key of REQUIRED) expect(output()).toContain(`${key} is not set`);
	});

	it.each(REQUIRED)('refuses without %s and names it', async (key) => {
		const env = productionSettings();
		delete env[key];
		const { exited, output } = runEntry(env);
		expect(await exited).toBe(1);
		expect(output()).toContain(`${key} is not set`);
		expect(output().match(/is not set/g)).toHaveLength(1);
	});

	it('refuses a short secret and an origin with a path', async () => {
		const env = { ...productionSettings(), AUTH_SECRET: 'short', ORIGIN: `${ORIGIN}/app` };
		const { exited, output } = runEntry(env);
		expect(await exited).toBe(1);
		expect(output()).toContain('AUTH_SECRET is too short');
		expect(output()).toContain('ORIGIN is the bare origin');
	});

	it('refuses when the database does not answer', async () => {
		const { exited, output } = runEntry({ ...productionSettings(), DB_PORT: '1' });
		expect(await exited).toBe(1);
		expect(output()).toContain('the database did not answer');
	});
});

describe('with its settings it starts, with no demo conveniences', () => {
	it('serves, is healthy, and has no outbox even when FAKE_MAIL_DIR and the demo switch are set', async () => {
		const entry = runEntry(
			{
				...productionSettings(),
				FAKE_MAIL_DIR: process.env.FAKE_MAIL_DIR!,
				SQUISHLINE_DEMO: '1'
			},
			60_000
		);
		started.push(entry);
		let health: Response | null = null;
		for (let i = 0; i < 200 && !health; i++) {
			health = await fetch(`${ORIGIN}/api/health`).catch(() => null);
			if (!health) await new Promise((r) => setTimeout(r, 100));
		}
		expect(health?.status, entry.output()).toBe(200);
		expect(entry.output()).toContain('Squishline (production)');
		expect((await fetch(`${ORIGIN}/dev/outbox`)).status).toBe(404);
		const home = await (await fetch(`${ORIGIN}/`)).text();
		expect(home).not.toContain('/dev/outbox');
		expect(home).toContain('Squishline');
	});

	it('compresses pages and JSON over 1 kB as the client asks, and nothing for a client that asks for none', async () => {
		// The entry from the test above is still running on PORT.
		const home = await raw('/', 'br, gzip');
		expect(home.encoding).toBe('br');
		expect(home.type).toContain('text/html');
		const list = await raw('/api/builds', 'gzip');
		expect(list.encoding).toBe('gzip');
		expect(list.type).toContain('application/json');
		const plain = await raw('/', null);
		expect(plain.encoding).toBeUndefined();
		// A page of markup compresses several times over.
		expect(home.bytes).toBeLessThan(plain.bytes / 3);
		// Under the 1 kB threshold nothing is compressed (the health answer is a few bytes).
		expect((await raw('/api/health', 'br, gzip')).encoding).toBeUndefined();
	});
});

/** One GET with exactly the Accept-Encoding given, read as bytes on the wire (not decoded). */
function raw(path: string, acceptEncoding: string | null) {
	return new Promise<{ encoding?: string; type: string; bytes: number }>((resolve, reject) => {
		const headers: Record<string, string> = acceptEncoding
			? { 'accept-encoding': acceptEncoding }
			: {};
		http
			.get(`${ORIGIN}${path}`, { headers }, (res) => {
				let bytes = 0;
				res.on('data', (c: Buffer) => (bytes += c.length));
				res.on('end', () =>
					resolve({
						encoding: res.headers['content-encoding'],
						type: String(res.headers['content-type'] ?? ''),
						bytes
					})
				);
			})
			.on('error', reject);
	});
}
