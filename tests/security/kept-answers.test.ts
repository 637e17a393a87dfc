import http from 'node:http';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/lib/server/db/connection';
import * as builds from '../../src/lib/server/sheet/builds';
import { saveBuild, setPublication } from '../../src/lib/server/sheet/build-service';
import { createComment } from '../../src/lib/server/comments/comments';
import { asUser } from '../support/events';
import { anyAddress, makeUser } from '../support/factories';
import { publishedBuild } from '../support/moderation-fixtures';
import { Client, startApp, type App } from './support/app';

// Whole anonymous answers kept per process (web/kept-answers.ts), over HTTP against the
// production entry: a reader who is not signed in gets the kept bytes while nothing changed, and
// the page as it is now the moment anything on it changes, whoever changed it and from where
// (here: this test process writing the database, as another app process would).
let app: App;
beforeAll(async () => {
	app = await startApp(3197);
});
afterAll(async () => {
	await app?.stop();
	await closeDb();
});

const kept = (r: Response) => r.headers.get('x-kept-answer');

/** The raw bytes as sent (fetch would decode them). */
function raw(
	path: string,
	encoding: string
): Promise<{ headers: http.IncomingHttpHeaders; body: Buffer }> {
	return new Promise((resolve, reject) => {
		const req = http.get(
			`${app.origin}${path}`,
			{ headers: { 'accept-encoding': encoding, 'x-forwarded-for': anyAddress() } },
			(res) => {
				const chunks: Buffer[] = [];
				res.on('data', (c: Buffer) => chunks.push(c));
				res.on('end', () => resolve({ headers: res.headers, body: Buffer.concat(chunks) }));
			}
		);
		req.on('error', reject);
	});
}

describe('kept anonymous answers', () => {
	it('a build page is made once, then served as kept, the same bytes in every coding', async () => {
		const owner = await makeUser();
		const { build } = await publishedBuild(owner.id, 'Kept answer lark');
		const path = `/builds/${build.id}`;
		const c = new Client(app.origin);
		const first = await c.fetch(path);
		expect(kept(first)).toBe('MISS');
		const html = await first.text();
		expect(html).toContain('Kept answer lark');
		const second = await c.fetch(path);
		expect(kept(second)).toBe('HIT');
		expect(await second.text()).toBe(html);
		expect(second.headers.get('etag')).toBe(first.headers.get('etag'));

		const br = await raw(path, 'br');
		expect(br.headers['content-encoding']).toBe('br');
		expect(br.headers.vary).toContain('Accept-Encoding');
		expect(brotliDecompressSync(br.body).toString()).toBe(html);
		const gz = await raw(path, 'gzip');
		expect(gz.headers['content-encoding']).toBe('gzip');
		expect(gunzipSync(gz.body).toString()).toBe(html);
		const plain = await raw(path, 'identity');
		expect(plain.headers['content-encoding']).toBeUndefined();
		expect(plain.body.toString()).toBe(html);
		// The security headers are the same on a kept answer.
		expect(second.headers.get('content-security-policy')).toBe(
			first.headers.get('content-security-policy')
		);
		expect(second.headers.get('x-frame-options')).toBe('DENY');
	});

	it('a change to the sheet, a new comment or unpublishing shows at the next request', async () => {
		const owner = await makeUser();
		const reader = await makeUser();
		const { build } = await publishedBuild(owner.id, 'Before the change');
		const path = `/builds/${build.id}`;
		const c = new Client(app.origin);
		await c.fetch(path);
		expect(kept(await c.fetch(path))).toBe('HIT');

		const fresh = (await builds.read(build.id))!;
		await saveBuild(build.id, fresh.version, { title: 'After the change' });
		const changed = await c.fetch(path);
		expect(kept(changed)).toBe('MISS');
		const text = await changed.text();
		expect(text).toContain('After the change');
		expect(text).not.toContain('Before the change');

		await createComment(
			asUser(reader),
			(await builds.read(build.id))!,
			{ body: 'Tried the same rollers, same result.' } as never,
			anyAddress(),
			new Date()
		);
		const commented = await c.fetch(path);
		expect(kept(commented)).toBe('MISS');
		expect(await commented.text()).toContain('Tried the same rollers, same result.');

		await setPublication((await builds.read(build.id))!, 'draft');
		expect((await c.fetch(path)).status).toBe(404);
		expect(await (await c.fetch('/api/builds?q=After+the+change')).text()).not.toContain(
			'After the change'
		);
	});

	it('signed-in readers and members who just saved are never served from it', async () => {
		const owner = await makeUser();
		const { build } = await publishedBuild(owner.id, 'Never kept for members');
		const path = `/builds/${build.id}`;
		const anon = new Client(app.origin);
		await anon.fetch(path);
		expect(kept(await anon.fetch(path))).toBe('HIT');
		const member = new Client(app.origin);
		await member.signIn(owner.email, owner.password);
		const own = await member.fetch(path);
		expect(own.status).toBe(200);
		expect(kept(own)).toBeNull();
		expect(await own.text()).toContain('Edit the sheet');
		const justSaved = await anon.fetch(path, { headers: { cookie: 'sl_written=0-1-5' } });
		expect(kept(justSaved)).toBeNull();
	});

	it('only public answers are kept: not a 404, not what says no-store', async () => {
		const c = new Client(app.origin);
		for (const path of ['/no-such-page', '/api/health']) {
			await c.fetch(path);
			expect(kept(await new Client(app.origin).fetch(path)), path).toBeNull();
		}
	});
});
