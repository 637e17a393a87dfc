import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/lib/server/db/connection';
import { verifyPasswordSignIn } from '../../src/lib/server/auth/password-signin';
import { models } from '../../src/lib/server/db/models';
import { listMail } from '../../src/lib/server/mail/outbox';
import { makeUser } from '../support/factories';
import { Client, startApp, type App } from './support/app';

// Sessions and sign-in against the production entry, over HTTP, as a thief and a sprayer would.
let app: App;
beforeAll(async () => {
	app = await startApp(3197);
});
afterAll(async () => {
	await app?.stop();
	await closeDb();
});

async function signedIn() {
	const u = await makeUser();
	const c = new Client(app.origin);
	const res = await c.signIn(u.email, u.password);
	expect([302, 303]).toContain(res.status);
	expect(c.sessionCookies().size).toBe(1);
	return { u, c };
}

/** Someone else holding a copy of the session cookie. */
function thief(c: Client): Client {
	const t = new Client(app.origin);
	for (const [k, v] of c.sessionCookies()) t.cookies.set(k, v);
	return t;
}

async function isSignedIn(c: Client): Promise<boolean> {
	const res = await c.fetch('/bench');
	if (res.status === 200) return true;
	expect(res.status).toBe(303);
	expect(res.headers.get('location')).toMatch(/^\/signin/);
	return false;
}

async function newestLink(to: string, part: string): Promise<string> {
	for (let i = 0; i < 100; i++) {
		const mail = (await listMail(to))[0];
		const m = mail?.text.match(new RegExp(`https?://\\S*${part}\\S*`));
		if (m) return m[0];
		await new Promise((r) => setTimeout(r, 100));
	}
	throw new Error(`no mail with ${part} to ${to}`);
}

describe('a session the database can end', () => {
	it('a password reset ends every older session, a stolen copy included', async () => {
		const { u, c } = await signedIn();
		const t = thief(c);
		expect(await isSignedIn(t)).toBe(true);

		expect((await new Client(app.origin).form('/reset', { email: u.email })).status).toBe(200);
		const link = new URL(await newestLink(u.email, '/reset/'));
		const done = await new Client(app.origin).form(link.pathname, {
			password: 'a brand new password 1',
			confirm: 'a brand new password 1'
		});
		expect([302, 303]).toContain(done.status);

		expect(await isSignedIn(t)).toBe(false);
		expect(await isSignedIn(c)).toBe(false);
		// The stolen cookie can no longer write either.
		const post = await t.fetch('/api/builds', {
			method: 'POST',
			headers: { 'content-type': 'application/json' },
			body: JSON.stringify({ title: 'not mine' })
		});
		expect(post.status).toBe(401);
	});

	it('signing out ends that session for good, even for a copy of the cookie', async () => {
		const { c } = await signedIn();
		const t = thief(c);
		expect((await c.form('/signout', {})).status).toBeLessThan(400);
		expect(await isSignedIn(t)).toBe(false);
	});

	it('"sign out everywhere" ends every session of the account', async () => {
		const { u, c } = await signedIn();
		const other = new Client(app.origin);
		await other.signIn(u.email, u.password);
		expect(await isSignedIn(other)).toBe(true);
		expect((await c.form('/profile?/signOutEverywhere', {})).status).toBe(303);
		expect(await isSignedIn(other)).toBe(false);
		expect(await isSignedIn(c)).toBe(false);
	});

	it('/auth/session answers nothing for a deleted account', async () => {
		const { u, c } = await signedIn();
		const before = await (await c.fetch('/auth/session')).json();
		expect(before?.user?.email).toBe(u.email);
		await models().User.destroy({ where: { id: u.id } });
		const after = await (await c.fetch('/auth/session')).json();
		expect(after?.user ?? null).toBeNull();
	});
});

describe('one password gate, whichever door', () => {
	it('spraying through /auth/callback/password stops at the per-address limit, then a right password is refused too', async () => {
		const real = await makeUser();
		const sprayer = new Client(app.origin);
		for (let i = 0; i < 30; i++) {
			const res = await sprayer.form('/auth/callback/password', {
				email: `nobody-${i}@tests.squishline.test`,
				password: 'Summer2026!'
			});
			expect(res.status).toBeLessThan(500);
		}
		const res = await sprayer.form('/auth/callback/password', {
			email: real.email,
			password: real.password
		});
		expect(res.headers.get('location') ?? '').toContain('code=address-limited');
		expect(sprayer.sessionCookies().size).toBe(0);
		// The form door shares the count, and its words do not blame one account.
		const form = await sprayer.signIn(real.email, real.password);
		expect(form.status).toBe(429);
		const page = await form.text();
		expect(page).toContain('Too many sign-in attempts from your network');
		expect(page).not.toContain('for this account');
		expect(sprayer.sessionCookies().size).toBe(0);
	});

	it('a completed reset lifts the account lock', async () => {
		const u = await makeUser();
		for (let i = 0; i < 5; i++) await new Client(app.origin).signIn(u.email, `wrong ${i}`);
		const locked = await new Client(app.origin).signIn(u.email, u.password);
		expect(await locked.text()).toContain('for this account');

		await new Client(app.origin).form('/reset', { email: u.email });
		const link = new URL(await newestLink(u.email, '/reset/'));
		await new Client(app.origin).form(link.pathname, {
			password: 'fresh password 22',
			confirm: 'fresh password 22'
		});
		const c = new Client(app.origin);
		expect([302, 303]).toContain((await c.signIn(u.email, 'fresh password 22')).status);
		expect(await isSignedIn(c)).toBe(true);
	});

	it('after sign-in, next cannot lead to another site', async () => {
		const { c } = await signedIn();
		for (const next of ['/%09/evil.example', '/%5Cevil.example', '//evil.example']) {
			const res = await c.fetch(`/signin?next=${next}`);
			expect(res.status).toBe(303);
			expect(res.headers.get('location')).toBe('/');
		}
	});
});

describe('mailed links come from ORIGIN only', () => {
	it('a forged X-Forwarded-Host does not reach the sign-in link', async () => {
		const u = await makeUser();
		const c = new Client(app.origin);
		const res = await c.form(
			'/signin?/link',
			{ email: u.email, next: '/' },
			{ 'x-forwarded-host': 'evil.example', 'x-forwarded-proto': 'https' }
		);
		expect([302, 303]).toContain(res.status);
		const link = await newestLink(u.email, '/auth/callback/link');
		expect(new URL(link).origin).toBe(app.origin);
		expect(link).not.toContain('evil.example');
	});

	it('a forged Host header does not reach the reset link', async () => {
		const u = await makeUser();
		// fetch will not send a forged Host, so this asks through a raw request.
		const body = new URLSearchParams({ email: u.email }).toString();
		const res = await rawPost('/reset', body, { host: 'evil.example', origin: app.origin });
		expect(res).toMatch(/^HTTP\/1.1 (200|303|403)/);
		if (res.startsWith('HTTP/1.1 403')) return; // refused outright is fine too
		const link = await newestLink(u.email, '/reset/');
		expect(new URL(link).origin).toBe(app.origin);
	});
});

async function rawPost(pathname: string, body: string, headers: Record<string, string>) {
	const net = await import('node:net');
	const url = new URL(app.origin);
	return new Promise<string>((resolve, reject) => {
		const s = net.connect(Number(url.port), url.hostname, () => {
			const lines = [
				`POST ${pathname} HTTP/1.1`,
				...Object.entries(headers).map(([k, v]) => `${k}: ${v}`),
				'x-forwarded-for: 10.99.99.99',
				'content-type: application/x-www-form-urlencoded',
				`content-length: ${Buffer.byteLength(body)}`,
				'connection: close',
				'',
				body
			];
			s.write(lines.join('\r\n'));
		});
		let out = '';
		s.on('data', (d) => (out += d));
		s.on('end', () => resolve(out));
		s.on('error', reject);
	});
}

describe('answers that do not tell whether an account exists', () => {
	const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
	async function timed(fn: () => Promise<unknown>): Promise<number> {
		const t0 = performance.now();
		await fn();
		return performance.now() - t0;
	}

	it('a wrong password costs the same argon2 work for an unknown address', async () => {
		const u = await makeUser();
		const known: number[] = [];
		const unknown: number[] = [];
		for (let i = 0; i < 4; i++) {
			known.push(await timed(() => verifyPasswordSignIn(u.email, `wrong ${i}`, `10.252.0.${i}`)));
			unknown.push(
				await timed(() =>
					verifyPasswordSignIn(`ghost-${i}-${u.email}`, `wrong ${i}`, `10.252.1.${i}`)
				)
			);
		}
		// Without the dummy hash an unknown address answered about 3× faster (argon2 skipped).
		expect(median(unknown)).toBeGreaterThan(median(known) * 0.6);
	});

	it('a reset request answers alike for a known and an unknown address (the mail is queued)', async () => {
		const u = await makeUser();
		const known: number[] = [];
		const unknown: number[] = [];
		for (let i = 0; i < 4; i++) {
			known.push(await timed(() => new Client(app.origin).form('/reset', { email: u.email })));
			unknown.push(
				await timed(() => new Client(app.origin).form('/reset', { email: `ghost-${i}-${u.email}` }))
			);
		}
		// Sending inline made a known address ~150 ms slower; the queue leaves a few ms.
		expect(median(known) - median(unknown)).toBeLessThan(40);
	});
});
