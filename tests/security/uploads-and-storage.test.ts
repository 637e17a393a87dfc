import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { ListObjectsV2Command } from '@aws-sdk/client-s3';
import { afterAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/lib/server/db/connection';
import * as builds from '../../src/lib/server/sheet/builds';
import { models } from '../../src/lib/server/db/models';
import * as setups from '../../src/lib/server/sheet/setups';
import type { SetupConfig } from '../../src/lib/server/db/models/setup';
import { Failure } from '../../src/lib/failure';
import {
	addPhoto,
	PHOTO_MAX_COUNT,
	STORAGE_DOWN,
	updatePhoto,
	withImage
} from '../../src/lib/server/sheet/photos';
import { addPart } from '../../src/lib/server/sheet/service';
import {
	flushLateDeletes,
	getObjectForReader,
	storage
} from '../../src/lib/server/storage/objects';
import { makeUser } from '../support/factories';
import { smallPng } from '../support/photos';

afterAll(closeDb);

async function draft(ownerId: string) {
	const b = await builds.create(ownerId, { title: 'Upload rules', chassis: 'Test frame' });
	const s = await setups.create(b.id, 'Stock baseline', true, {} as SetupConfig);
	return { b, s };
}

const refusedField = async (p: Promise<unknown>) => {
	const e = await p.then(
		() => null,
		(x: unknown) => x
	);
	expect(e).toBeInstanceOf(Failure);
	expect((e as Failure).status).toBe(422);
	expect((e as Failure).issues[0].path).toBe('setupId');
};

describe('a part or photo names only a setup of its own build', () => {
	it('refuses a missing setup id and another member’s draft setup, with the field named', async () => {
		const me = await makeUser();
		const other = await makeUser();
		const mine = await draft(me.id);
		const theirs = await draft(other.id);
		const part = { category: 'exhaust', name: 'Test pipe', cost: '10', link: '' };
		await refusedField(addPart(mine.b.id, { ...part, setupId: '999999999' }));
		await refusedField(addPart(mine.b.id, { ...part, setupId: String(theirs.s.id) }));
		await refusedField(addPhoto(mine.b.id, await smallPng(), { setupId: theirs.s.id }));
		await refusedField(addPhoto(mine.b.id, await smallPng(), { setupId: 999999999 }));
		const photo = await addPhoto(mine.b.id, await smallPng(), { setupId: mine.s.id });
		await refusedField(updatePhoto(mine.b.id, photo.id, { setupId: theirs.s.id }));
		// Its own setup is fine.
		await addPart(mine.b.id, { ...part, setupId: String(mine.s.id) });
		expect(await models().Part.count({ where: { buildId: mine.b.id } })).toBe(1);
	});
});

/** A PNG header claiming width × height, with a token of image data: enough to read its size. */
function pngClaiming(width: number, height: number): Uint8Array {
	const chunk = (type: string, data: Buffer) => {
		const len = Buffer.alloc(4);
		len.writeUInt32BE(data.length);
		const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
		const crc = Buffer.alloc(4);
		crc.writeUInt32BE(zlib.crc32(body) >>> 0);
		return Buffer.concat([len, body, crc]);
	};
	const ihdr = Buffer.alloc(13);
	ihdr.writeUInt32BE(width, 0);
	ihdr.writeUInt32BE(height, 4);
	ihdr.set([8, 2, 0, 0, 0], 8); // 8-bit RGB, deflate, no filter, no interlace
	return Buffer.concat([
		Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
		chunk('IHDR', ihdr),
		chunk('IDAT', zlib.deflateSync(Buffer.alloc(64))),
		chunk('IEND', Buffer.alloc(0))
	]);
}

describe('upload limits', () => {
	it('six uploads at once onto a build holding ten: two are kept, never more than twelve', async () => {
		const me = await makeUser();
		const { b } = await draft(me.id);
		const png = await smallPng();
		for (let i = 0; i < PHOTO_MAX_COUNT - 2; i++) await addPhoto(b.id, png);
		const results = await Promise.allSettled(Array.from({ length: 6 }, () => addPhoto(b.id, png)));
		expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(2);
		for (const r of results.filter((r) => r.status === 'rejected'))
			expect((r as PromiseRejectedResult).reason).toMatchObject({ status: 409 });
		expect(await models().Photo.count({ where: { buildId: b.id } })).toBe(PHOTO_MAX_COUNT);
		// The refused ones left no objects behind.
		const listed = await storage().client.send(
			new ListObjectsV2Command({ Bucket: storage().bucket, Prefix: `builds/${b.id}/photos/` })
		);
		expect(listed.KeyCount).toBe(PHOTO_MAX_COUNT * 2);
	});

	it.each([
		[20000, 20000],
		[16000, 16000]
	])('a %i × %i PNG is refused as too large in pixels, not as a wrong type', async (w, h) => {
		const me = await makeUser();
		const { b } = await draft(me.id);
		const e = await addPhoto(b.id, pngClaiming(w, h)).catch((x: unknown) => x);
		expect(e).toBeInstanceOf(Failure);
		expect((e as Failure).status).toBe(413);
		expect((e as Failure).message).toContain(`${w} × ${h} pixels`);
		expect((e as Failure).message).not.toContain('not a JPEG');
	});

	it('image work runs at most two at a time', async () => {
		let running = 0;
		let most = 0;
		const png = await smallPng();
		await Promise.all(
			Array.from({ length: 6 }, () =>
				withImage(png, async (img) => {
					running++;
					most = Math.max(most, running);
					await new Promise((r) => setTimeout(r, 30));
					await img.metadata();
					running--;
				})
			)
		);
		expect(most).toBe(2);
	});
});

describe('the object store frozen', () => {
	let store: ChildProcess | null = null;
	const saved = { endpoint: process.env.S3_ENDPOINT, timeout: process.env.S3_TIMEOUT_MS };
	afterAll(() => {
		store?.kill('SIGCONT');
		store?.kill('SIGTERM');
		process.env.S3_ENDPOINT = saved.endpoint;
		process.env.S3_TIMEOUT_MS = saved.timeout;
	});

	it('an upload fails in seconds with words, and leaves nothing behind even after the store resumes', async () => {
		const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'squishline-frozen-'));
		const port = 4591;
		store = spawn(process.execPath, ['fake-storage/s3.js'], {
			cwd: path.resolve(import.meta.dirname, '../..'),
			env: { ...process.env, S3_PORT: String(port), S3_DATA_DIR: dir },
			stdio: 'ignore'
		});
		process.env.S3_ENDPOINT = `http://127.0.0.1:${port}`;
		process.env.S3_TIMEOUT_MS = '700';
		await expect
			.poll(
				() =>
					fetch(process.env.S3_ENDPOINT!).then(
						() => true,
						() => false
					),
				{
					timeout: 10_000
				}
			)
			.toBe(true);

		const me = await makeUser();
		const { b } = await draft(me.id);
		store.kill('SIGSTOP');
		const t0 = Date.now();
		const e = await addPhoto(b.id, await smallPng()).catch((x: unknown) => x);
		expect(Date.now() - t0).toBeLessThan(10_000);
		expect(e).toBeInstanceOf(Failure);
		expect((e as Failure).status).toBe(503);
		expect((e as Failure).message).toBe(STORAGE_DOWN);
		expect(await models().Photo.count({ where: { buildId: b.id } })).toBe(0);

		// Reading a photo while frozen answers 503 with words, in seconds.
		const read = await getObjectForReader('builds/1/anything.jpg').catch((x: unknown) => x);
		expect(read).toMatchObject({ status: 503 });

		// The store wakes up and finishes whatever it was holding; the late deletes clear it.
		store.kill('SIGCONT');
		await new Promise((r) => setTimeout(r, 1500));
		await flushLateDeletes();
		const listed = await storage().client.send(
			new ListObjectsV2Command({ Bucket: storage().bucket, Prefix: `builds/${b.id}/` })
		);
		expect(listed.KeyCount ?? 0).toBe(0);
	});
});
