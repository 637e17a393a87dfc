import http from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/lib/server/db/connection';
import * as users from '../../src/lib/server/auth/users';
import { compose } from '../../src/lib/server/mail/send';
import { unsubscribeUrl } from '../../src/lib/server/mail/unsubscribe';
import { makeUser } from '../support/factories';
import { Client, startApp, type App } from './support/app';

// Response headers, body caps and the one-click unsubscribe, over HTTP against the production
// entry; a second instance runs with an https ORIGIN for HSTS and Secure cookies.
let app: App;
let https: App;
beforeAll(async () => {
	[app, https] = await Promise.all([
		startApp(3198),
		startApp(3199, { ORIGIN: 'https://127.0.0.1:3199' })
	]);
});
afterAll(async () => {
	await Promise.all([app?.stop(), https?.stop()]);
	await closeDb();
});

describe('security headers', () => {
	it('a page carries a hash-based CSP with no inline scripts, and cannot be framed', async () => {
		const res = await new Client(app.origin).fetch('/signin');
		const csp = res.headers.get('content-security-policy') ?? '';
		const script = csp.split(';').find((d) => d.trim().startsWith('script-src')) ?? '';
		// Only the exact scripts SvelteKit wrote into the page may run (CSP Level 3, hash-source).
		expect(script).toMatch(/'sha256-[A-Za-z0-9+/=]+'/);
		expect(script).not.toContain('nonce-');
		expect(script).not.toContain('unsafe-inline');
		expect(csp).toContain("frame-ancestors 'none'");
		expect(csp).toContain("object-src 'none'");
		expect(res.headers.get('x-frame-options')).toBe('DENY');
	});

	it.each(['/', '/api/builds', '/api/health', '/signin', '/no-such-page'])(
		'%s has nosniff, a referrer policy and a permissions policy',
		async (path) => {
			const res = await new Client(app.origin).fetch(path);
			expect(res.headers.get('x-content-type-options')).toBe('nosniff');
			expect(res.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
			expect(res.headers.get('permissions-policy')).toContain('camera=()');
			expect(res.headers.get('strict-transport-security')).toBeNull();
		}
	);

	it('with an https ORIGIN: HSTS, and the session cookie is Secure', async () => {
		const c = new Client('https://127.0.0.1:3199', undefined, https.origin);
		const page = await c.fetch('/');
		expect(page.headers.get('strict-transport-security')).toContain('max-age=');
		const u = await makeUser();
		const res = await c.signIn(u.email, u.password);
		const session = res.headers.getSetCookie().find((h) => h.includes('session-token'));
		expect(session).toMatch(/^__Secure-/);
		expect(session).toMatch(/;\s*Secure/i);
	});
});

describe('anonymous answers', () => {
	it('a public page or JSON read without signing in sets no cookie, so a shared cache may keep it', async () => {
		const c = new Client(app.origin);
		const list = await c.fetch('/api/builds');
		const first = ((await list.json()) as { builds: { id: number }[] }).builds[0];
		expect(list.headers.getSetCookie()).toEqual([]);
		for (const path of ['/', '/builds', `/builds/${first.id}`, '/speed-map', '/api/builds'])
			expect((await c.fetch(path)).headers.getSetCookie(), path).toEqual([]);
	});

	it('a build page and public JSON carry an ETag and answer 304 to it; signed in, nothing is public', async () => {
		const c = new Client(app.origin);
		const list = await c.fetch('/api/builds');
		const first = ((await list.json()) as { builds: { id: number }[] }).builds[0];
		for (const path of [`/builds/${first.id}`, '/api/builds']) {
			const res = await c.fetch(path);
			const etag = res.headers.get('etag');
			expect(etag, path).toMatch(/^"[^"]+"$/);
			expect(res.headers.get('cache-control'), path).toBe('public, max-age=0, must-revalidate');
			expect(res.headers.get('vary'), path).toContain('Cookie');
			const again = await c.fetch(path, { headers: { 'if-none-match': etag! } });
			expect(again.status, path).toBe(304);
			expect(await again.text(), path).toBe('');
		}
		const u = await makeUser();
		const member = new Client(app.origin);
		await member.signIn(u.email, u.password);
		const own = await member.fetch(`/builds/${first.id}`);
		expect(own.status).toBe(200);
		expect(own.headers.get('cache-control') ?? '').not.toContain('public');
	});
});

describe('body caps', () => {
	it('an anonymous 30 MB POST to /signin gets 413 with words, without being read', async () => {
		// A connection of its own: the server closes it without reading the rest of the body.
		const t0 = Date.now();
		const answer = await new Promise<{ status: number; text: string }>((resolve, reject) => {
			const req = http.request(
				new URL('/signin?/password', app.origin),
				{
					method: 'POST',
					agent: false,
					headers: {
						'content-type': 'application/x-www-form-urlencoded',
						'content-length': String(30 * 1024 * 1024),
						accept: 'text/html',
						origin: app.origin,
						'x-forwarded-for': '10.251.0.1'
					}
				},
				(res) => {
					let text = '';
					res.on('data', (d) => (text += d));
					res.on('end', () => resolve({ status: res.statusCode ?? 0, text }));
				}
			);
			req.on('error', reject);
			req.write(Buffer.alloc(64 * 1024)); // the rest is never sent: the answer must not wait for it
		});
		expect(answer.status).toBe(413);
		expect(answer.text).toMatch(/at most 256 kB\)\. Nothing was saved\./);
		expect(Date.now() - t0).toBeLessThan(10_000);
	});

	it('the JSON API says the same as JSON', async () => {
		const res = await new Client(app.origin).fetch('/api/builds', {
			method: 'POST',
			headers: { 'content-type': 'application/json' },
			body: JSON.stringify({ story: 'x'.repeat(400 * 1024) })
		});
		expect(res.status).toBe(413);
		expect((await res.json()).error).toMatch(/at most 256 kB/);
	});
});

describe('one-click unsubscribe (RFC 8058)', () => {
	it('every mail with List-Unsubscribe also has List-Unsubscribe-Post', () => {
		const letter = compose({
			to: 'a@b.test',
			subject: 's',
			paragraphs: ['p'],
			unsubscribeUrl: 'http://127.0.0.1/unsubscribe/t'
		});
		expect(letter.headers?.['List-Unsubscribe']).toBe('<http://127.0.0.1/unsubscribe/t>');
		expect(letter.headers?.['List-Unsubscribe-Post']).toBe('List-Unsubscribe=One-Click');
	});

	it("accepts the provider's POST without an Origin header; other forms still need one", async () => {
		const u = await makeUser();
		await users.update(u.id, { mailComments: true });
		const url = new URL(unsubscribeUrl(u.id, 'comments'));
		const res = await fetch(new URL(url.pathname, app.origin), {
			method: 'POST',
			headers: {
				'content-type': 'application/x-www-form-urlencoded',
				'x-forwarded-for': '10.250.0.1'
			},
			body: 'List-Unsubscribe=One-Click'
		});
		expect(res.status).toBe(200);
		expect((await users.read(u.id))?.mailComments).toBe(false);

		const forged = await fetch(new URL('/signin?/link', app.origin), {
			method: 'POST',
			headers: {
				'content-type': 'application/x-www-form-urlencoded',
				origin: 'https://evil.example',
				'x-forwarded-for': '10.250.0.2'
			},
			body: 'email=a%40b.test'
		});
		expect(forged.status).toBe(403);
	});
});
