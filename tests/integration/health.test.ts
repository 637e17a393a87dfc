import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import S3rver from 's3rver';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { closeDb } from '../../src/lib/server/db/connection';
import { forgetMailCheck } from '../../src/lib/server/web/health';
import { mailer } from '../../src/lib/server/mail/send';
import { GET } from '../../src/routes/api/health/+server';

// The health route against the real database and mail server, with an object store of the
// test's own that it can stop.
let server: S3rver;
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'squishline-s3-'));
const savedEndpoint = process.env.S3_ENDPOINT;

beforeAll(async () => {
	server = new S3rver({
		address: '127.0.0.1',
		port: 0,
		directory: dir,
		silent: true,
		configureBuckets: [{ name: process.env.S3_BUCKET ?? 'squishline', configs: [] }]
	});
	const { port } = await server.run();
	process.env.S3_ENDPOINT = `http://127.0.0.1:${port}`;
});

afterAll(async () => {
	process.env.S3_ENDPOINT = savedEndpoint;
	fs.rmSync(dir, { recursive: true, force: true });
	await closeDb();
});

const admin = { id: 'a', role: 'admin' };
const call = async (user: object | null = admin) => {
	const res = await GET({ locals: { user } } as never);
	return { status: res.status, body: await res.json() };
};

describe('GET /api/health', () => {
	it('answers 200 with every service up', async () => {
		const { status, body } = await call();
		expect(status).toBe(200);
		expect(body.down).toEqual([]);
		expect(body.services.database.up).toBe(true);
		expect(body.services['object store'].up).toBe(true);
		expect(body.services['mail server'].up).toBe(true);
		expect(body.mailWaiting).toBeTypeOf('number');
	});

	it('asks the mail relay at most once a minute, however often it is probed', async () => {
		forgetMailCheck();
		const verify = vi.spyOn(mailer(), 'verify');
		try {
			for (let i = 0; i < 5; i++) expect((await call(null)).status).toBe(200);
			expect(verify).toHaveBeenCalledTimes(1);
		} finally {
			verify.mockRestore();
		}
	});

	it('answers 503 naming the object store once it is stopped — to admins only', async () => {
		await server.close();
		const { status, body } = await call();
		expect(status).toBe(503);
		expect(body.down).toEqual(['object store']);
		expect(body.error).toContain('object store');
		expect(body.services.database.up).toBe(true);

		for (const visitor of [null, { id: 'm', role: 'member' }, { id: 'd', role: 'moderator' }]) {
			const pub = await call(visitor);
			expect(pub.status).toBe(503);
			expect(pub.body).toEqual({ status: 'down' });
		}
	});
});
