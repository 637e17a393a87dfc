import { afterAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/lib/server/db/connection';
import { models } from '../../src/lib/server/db/models';
import { createBuild } from '../../src/lib/server/sheet/build-service';
import { saveSetup } from '../../src/lib/server/sheet/service';
import { POST as runsPost } from '../../src/routes/api/builds/[id=id]/setups/[setupId=id]/runs/+server';
import { POST as buildsPost } from '../../src/routes/api/builds/+server';
import { asUser, fakeEvent } from '../support/events';
import { makeUser } from '../support/factories';
import { FIXTURE_SETUP, fixtureRun as storedRun } from '../support/sheet-fixtures';

/** A run as JSON: the stored fixture without its empty (null) fields. */
const fixtureRun = (speed: number) =>
	Object.fromEntries(Object.entries(storedRun(speed)).filter(([, v]) => v !== null));

// A client that lost the answer to a create (the run was stored, the reply was a 500 or never
// came) retries with the same Idempotency-Key and gets the first answer, not a second run.
// The header is draft-ietf-httpapi-idempotency-key-header (IETF HTTPAPI working group draft).

afterAll(closeDb);

const post = (
	handler: (e: never) => unknown,
	user: ReturnType<typeof asUser>,
	params: Record<string, string>,
	body: unknown,
	key?: string
) =>
	handler(
		fakeEvent({
			user,
			params,
			path: '/api/x',
			request: {
				method: 'POST',
				body: JSON.stringify(body),
				headers: {
					'content-type': 'application/json',
					...(key ? { 'idempotency-key': key } : {})
				}
			}
		})
	) as Promise<Response>;

async function sheet() {
	const u = await makeUser();
	const me = asUser(u);
	const b = await createBuild(u.id, { title: 'Idempotent', chassis: 'Lark' });
	const { id: setupId } = await saveSetup(b.id, FIXTURE_SETUP);
	const params = { id: String(b.id), setupId: String(setupId) };
	const runs = () => models().Run.count({ where: { setupId } });
	return { u, me, b, setupId, params, runs };
}

describe('Idempotency-Key on JSON creates', () => {
	it('a retried run with the same key makes one run and answers the same', async () => {
		const { me, params, runs } = await sheet();
		const body = fixtureRun(64);
		const first = await post(runsPost, me, params, body, 'run-7f3a');
		expect(first.status).toBe(201);
		const again = await post(runsPost, me, params, body, 'run-7f3a');
		expect(again.status).toBe(201);
		expect(again.headers.get('idempotent-replayed')).toBe('true');
		expect(await again.json()).toEqual(await first.json());
		expect(await runs()).toBe(1);
	});

	it('two requests racing with one key make one run', async () => {
		const { me, params, runs } = await sheet();
		const body = fixtureRun(65);
		const answers = await Promise.all([
			post(runsPost, me, params, body, 'race-1'),
			post(runsPost, me, params, body, 'race-1')
		]);
		expect(answers.map((r) => r.status)).toEqual([201, 201]);
		const [a, b] = await Promise.all(answers.map((r) => r.json()));
		expect(a).toEqual(b);
		expect(await runs()).toBe(1);
	});

	it('the same key with another body is refused; without a key every POST creates', async () => {
		const { me, params, runs } = await sheet();
		await post(runsPost, me, params, fixtureRun(60), 'k-1');
		const other = await post(runsPost, me, params, fixtureRun(61), 'k-1');
		expect(other.status).toBe(422);
		expect((await other.json()).error).toMatch(/different request/);
		await post(runsPost, me, params, fixtureRun(62));
		await post(runsPost, me, params, fixtureRun(62));
		expect(await runs()).toBe(3);
	});

	it('keys belong to their member, and a malformed key is refused', async () => {
		const one = await makeUser();
		const two = await makeUser();
		const body = { title: 'Same key, two members', chassis: 'Lark' };
		const a = await post(buildsPost, asUser(one), {}, body, 'shared');
		const b = await post(buildsPost, asUser(two), {}, body, 'shared');
		expect((await a.json()).id).not.toBe((await b.json()).id);
		const bad = await post(buildsPost, asUser(one), {}, body, 'has space');
		expect(bad.status).toBe(400);
	});
});
