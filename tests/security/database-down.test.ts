import { isHttpError } from '@sveltejs/kit';
import { afterAll, describe, expect, it } from 'vitest';
import { loadCurrentUser } from '../../src/lib/server/auth/current-user';
import { closeDb } from '../../src/lib/server/db/connection';
import { DB_UNAVAILABLE } from '../../src/lib/server/db/unavailable';
import { GET as listApi, POST as createApi } from '../../src/routes/api/builds/+server';
import { load as listPage } from '../../src/routes/builds/+page.server';

// MariaDB out of reach: pages and the API answer 503 with the same words for every caller.
const savedPort = process.env.DB_PORT;
afterAll(async () => {
	await closeDb();
	process.env.DB_PORT = savedPort;
	await closeDb();
});

const member = {
	id: '00000000-0000-4000-8000-000000000001',
	email: 'm@tests.squishline.test',
	name: 'M',
	role: 'member',
	units: 'metric',
	theme: 'device',
	suspension: null
};

function event(user: typeof member | null, init: RequestInit = {}, path = '/api/builds') {
	const url = new URL(`http://127.0.0.1${path}`);
	return {
		url,
		params: {},
		locals: { user },
		request: new Request(url, init),
		cookies: { get: () => undefined },
		getClientAddress: () => '127.0.0.1'
	} as never;
}

describe('with the database down', () => {
	it('answers 503 "nothing was saved", signed in or not, page or API', async () => {
		await closeDb();
		process.env.DB_PORT = '1'; // nothing listens there

		for (const user of [null, member]) {
			const res = await listApi(event(user));
			expect(res.status).toBe(503);
			expect((await res.json()).error).toBe(DB_UNAVAILABLE);

			const thrown = await Promise.resolve(listPage(event(user, {}, '/builds'))).catch(
				(e: unknown) => e
			);
			expect(isHttpError(thrown) && thrown.status).toBe(503);
			expect(isHttpError(thrown) && thrown.body.message).toBe(DB_UNAVAILABLE);
		}
		const write = await createApi(
			event(member, {
				method: 'POST',
				headers: { 'content-type': 'application/json' },
				body: JSON.stringify({ title: 'Lost?' })
			})
		);
		expect(write.status).toBe(503);
		expect((await write.json()).error).toContain('nothing was saved');

		// The hook that reads the signed-in account on every request says the same.
		const hook = await loadCurrentUser(member.id).catch((e: unknown) => e);
		expect(isHttpError(hook) && hook.status).toBe(503);
	});
});
