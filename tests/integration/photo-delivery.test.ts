import sharp from 'sharp';
import { afterAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/lib/server/db/connection';
import { env } from '../../src/lib/server/env';
import { buildPage } from '../../src/lib/server/pages/build-page';
import * as builds from '../../src/lib/server/sheet/builds';
import { addPhoto } from '../../src/lib/server/sheet/photos';
import { WINDOW_S } from '../../src/lib/server/storage/links';
import { GET as photoGet } from '../../src/routes/api/photos/[id=id]/[size]/+server';
import { asUser, fakeEvent } from '../support/events';
import { makeUser } from '../support/factories';
import { publishedBuild } from '../support/moderation-fixtures';

afterAll(closeDb);

const jpeg = async () =>
	new Uint8Array(
		await sharp({ create: { width: 640, height: 480, channels: 3, background: '#556677' } })
			.jpeg()
			.toBuffer()
	);

describe('photos', () => {
	it('of a published sheet load straight from the store, signed, stable within a window, cached for good', async () => {
		const owner = await makeUser();
		const { build } = await publishedBuild(owner.id, 'Photo delivery');
		await addPhoto(build.id, await jpeg());
		const at = new Date(Math.ceil(Date.now() / 1000 / WINDOW_S) * WINDOW_S * 1000 + 60_000);
		const page = await buildPage(build, null, 'metric', at);
		const { display, thumb } = page.photos[0];
		for (const link of [display, thumb]) {
			expect(link.startsWith(`${env().S3_ENDPOINT}/`)).toBe(true);
			expect(new URL(link).searchParams.get('X-Amz-Signature')).toMatch(/^[0-9a-f]{64}$/);
		}
		// Later in the same window, the same bytes (the page's ETag holds); in the next, new ones.
		const later = await buildPage(build, null, 'metric', new Date(at.getTime() + 3_600_000));
		expect(later.photos[0].display).toBe(display);
		const next = await buildPage(build, null, 'metric', new Date(at.getTime() + WINDOW_S * 1000));
		expect(next.photos[0].display).not.toBe(display);

		// The store answers the signed link itself, with the immutable Cache-Control stored with it.
		const got = await fetch(display);
		expect(got.status).toBe(200);
		expect(got.headers.get('content-type')).toBe('image/jpeg');
		expect(got.headers.get('cache-control')).toBe('public, max-age=31536000, immutable');
		expect((await got.arrayBuffer()).byteLength).toBeGreaterThan(1000);
	});

	it('of a draft stay behind its access rule, with an ETag that answers 304', async () => {
		const owner = await makeUser();
		const b = await builds.create(owner.id, { title: 'Draft photo delivery' });
		const photo = await addPhoto(b.id, await jpeg());
		const page = await buildPage(b, asUser(owner), 'metric', new Date());
		expect(page.photos[0].display).toBe(`/api/photos/${photo.id}/display`);
		const get = (headers: Record<string, string> = {}) =>
			photoGet(
				fakeEvent({
					user: asUser(owner),
					params: { id: String(photo.id), size: 'display' },
					path: `/api/photos/${photo.id}/display`,
					request: { method: 'GET', headers }
				}) as never
			);
		const first = await get();
		expect(first.status).toBe(200);
		const etag = first.headers.get('etag')!;
		expect(etag).toMatch(/^"[^"]+"$/);
		expect(first.headers.get('cache-control')).toBe('private, no-cache');
		const again = await get({ 'if-none-match': etag });
		expect(again.status).toBe(304);
		expect(await again.text()).toBe('');
	});
});
