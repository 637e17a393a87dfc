import Ajv2020 from 'ajv/dist/2020';
import sharp from 'sharp';
import { afterAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/lib/server/db/connection';
import * as builds from '../../src/lib/server/sheet/builds';
import { exportBuild } from '../../src/lib/server/sheet/export';
import { saveRun, saveSetup } from '../../src/lib/server/sheet/service';
import { addPhoto } from '../../src/lib/server/sheet/photos';
import { objectExists } from '../../src/lib/server/storage/objects';
import { GET as photoGet } from '../../src/routes/api/photos/[id=id]/[size]/+server';
import { POST as buildsPost } from '../../src/routes/api/builds/+server';
import {
	DELETE as buildDelete,
	GET as buildGet,
	PATCH as buildPatch
} from '../../src/routes/api/builds/[id=id]/+server';
import { POST as importPost } from '../../src/routes/api/builds/import/+server';
import { POST as photoPost } from '../../src/routes/api/builds/[id=id]/photos/+server';
import { GET as schemaGet } from '../../src/routes/api/schema/build-sheet.json/+server';
import { GET as csvGet } from '../../src/routes/api/builds/[id=id]/runs.csv/+server';
import { asUser, fakeEvent } from '../support/events';
import { makeUser } from '../support/factories';
import { FIXTURE_SETUP } from '../support/sheet-fixtures';
import { models } from '../../src/lib/server/db/models';
import { PATCH as setupPatch } from '../../src/routes/api/builds/[id=id]/setups/[setupId=id]/+server';

afterAll(closeDb);

const jsonReq = (method: string, body: string) => ({
	method,
	body,
	headers: { 'content-type': 'application/json' }
});
const call = (h: (e: never) => unknown, e: unknown) => h(e as never) as Promise<Response>;

async function fullBuild(ownerId: string) {
	const b = await builds.create(ownerId, {
		title: 'Export round trip',
		chassis: 'Vallance Sprint 13-inch',
		engineFamily: 'horizontal 50 cc two-stroke',
		brakeFront: 'disc',
		brakeRear: 'drum',
		story: '**Notes**'
	});
	const a = (await saveSetup(b.id, {
		changeNote: 'Stock baseline',
		isStock: true,
		bore: 40,
		stroke: 39.2,
		squish: 1.2,
		carbBore: 12,
		mainJet: 80,
		jetNumbering: 'diameter',
		exhaustType: 'stock',
		rollerWeights: '6x5.5',
		primaryDriver: 13,
		primaryDriven: 43,
		rearTyre: '130/60-13 53P',
		peakRpm: 7000,
		lubrication: 'premix',
		kitMaterial: 'cast-iron'
	})) as { id: number };
	await saveRun(b.id, a.id, {
		runOn: '2026-04-02',
		speed: 51.5,
		method: 'radar',
		twoWay: true,
		venue: 'closed-course',
		elevation: 300,
		temp: 12,
		humidity: 70,
		pressure: 101.2,
		pressureKind: 'sea-level',
		chtSensor: 'plug-washer',
		chtFull: 190,
		notes: 'calm',
		plugReading: 'tan'
	});
	const c = (await saveSetup(b.id, {
		changeNote: '70 cc kit',
		isStock: false,
		bore: 47,
		stroke: 39.2,
		squish: 0.8,
		carbBore: 17,
		mainJet: 92,
		jetNumbering: 'diameter',
		exhaustType: 'expansion-chamber',
		rollerWeights: '3x5.0 + 3x4.5',
		primaryDriver: 15,
		primaryDriven: 43,
		rearTyre: '130/60-13 53P',
		peakRpm: 10200,
		lubrication: 'premix',
		kitMaterial: 'cast-iron'
	})) as { id: number };
	await saveRun(b.id, c.id, {
		runOn: '2026-06-02',
		speed: 88,
		method: 'gps-logger',
		twoWay: false,
		venue: 'private-ground',
		elevation: 300,
		temp: 24,
		humidity: 50,
		pressure: null,
		pressureKind: 'sea-level',
		chtSensor: 'plug-washer',
		notes: ''
	});
	return b;
}

describe('export and import', () => {
	it('the export validates against the served JSON Schema and re-imports to an equal draft', async () => {
		const owner = await makeUser();
		const b = await fullBuild(owner.id);
		const schema = await (await call(schemaGet, fakeEvent({}))).json();
		const doc = await exportBuild(b);
		const validate = new Ajv2020({ strict: false, allErrors: true }).compile(schema);
		expect(validate(doc), JSON.stringify(validate.errors)).toBe(true);

		const res = await call(
			importPost,
			fakeEvent({ user: asUser(owner), request: jsonReq('POST', JSON.stringify(doc)) })
		);
		expect(res.status).toBe(201);
		const { id } = await res.json();
		expect(id).not.toBe(b.id);
		const copy = (await builds.read(id))!;
		expect(copy.publication).toBe('draft');
		const again = await exportBuild(copy);
		const strip = ({ exportedAt: _a, source: _s, ...rest }: typeof doc) => rest;
		expect(strip(again)).toEqual(strip(doc));
	});

	it('a bad import lists every problem with its path and creates nothing', async () => {
		const owner = await makeUser();
		const before = await builds.listBench(owner.id);
		const res = await call(
			importPost,
			fakeEvent({
				user: asUser(owner),
				request: jsonReq(
					'POST',
					JSON.stringify({
						format: 'squishline.build-sheet',
						version: 1,
						build: { title: '' },
						setups: [{ changeNote: 'x', config: { bore: 500 } }]
					})
				)
			})
		);
		expect(res.status).toBe(422);
		const paths = (await res.json()).issues.map((i: { path: string }) => i.path);
		expect(paths).toEqual(
			expect.arrayContaining(['build.title', 'setups.0.changeNote', 'setups.0.config.bore'])
		);
		expect(await builds.listBench(owner.id)).toHaveLength(before.length);
	});

	it('gives the runs as CSV with their setup’s key numbers', async () => {
		const owner = await makeUser();
		const b = await fullBuild(owner.id);
		const res = await call(
			csvGet,
			fakeEvent({ user: asUser(owner), params: { id: String(b.id) } })
		);
		expect(res.headers.get('content-type')).toMatch(/text\/csv/);
		const lines = (await res.text()).trim().split('\r\n');
		expect(lines).toHaveLength(3);
		expect(lines[0]).toMatch(/^run_date,speed_kmh,/);
		expect(lines[2]).toContain('70 cc kit');
	});
});

describe('status codes of the JSON API', () => {
	it('answers 201, 200, 204, 400, 401, 403, 404, 409, 413, 415 and 422 where they belong', async () => {
		const owner = await makeUser();
		const other = await makeUser();
		const me = asUser(owner);
		expect(
			(
				await call(
					buildsPost,
					fakeEvent({ user: null, path: '/api/builds', request: jsonReq('POST', '{}') })
				)
			).status
		).toBe(401);
		expect(
			(
				await call(
					buildsPost,
					fakeEvent({ user: me, path: '/api/builds', request: jsonReq('POST', '{oops') })
				)
			).status
		).toBe(400);
		expect(
			(
				await call(
					buildsPost,
					fakeEvent({
						user: me,
						path: '/api/builds',
						request: {
							method: 'POST',
							body: 'title=x',
							headers: { 'content-type': 'application/x-www-form-urlencoded' }
						}
					})
				)
			).status
		).toBe(415);
		const bad = await call(
			buildsPost,
			fakeEvent({ user: me, path: '/api/builds', request: jsonReq('POST', '{"title":""}') })
		);
		expect(bad.status).toBe(422);
		expect((await bad.json()).issues[0]).toMatchObject({ path: 'title' });
		const made = await call(
			buildsPost,
			fakeEvent({
				user: me,
				path: '/api/builds',
				request: jsonReq('POST', '{"title":"API build"}')
			})
		);
		expect(made.status).toBe(201);
		const { id } = await made.json();
		const params = { id: String(id) };
		expect(
			(await call(buildGet, fakeEvent({ user: asUser(other), params, path: `/api/builds/${id}` })))
				.status
		).toBe(404);
		expect(
			(await call(buildGet, fakeEvent({ user: me, params, path: `/api/builds/${id}` }))).status
		).toBe(200);
		const patched = await call(
			buildPatch,
			fakeEvent({
				user: me,
				params,
				path: `/api/builds/${id}`,
				request: jsonReq('PATCH', '{"version":0,"chassis":"Quennel Strada"}')
			})
		);
		expect(patched.status).toBe(200);
		expect(
			(
				await call(
					buildPatch,
					fakeEvent({
						user: me,
						params,
						path: `/api/builds/${id}`,
						request: jsonReq('PATCH', '{"version":0,"chassis":"stale"}')
					})
				)
			).status
		).toBe(409);
		expect(
			(
				await call(
					buildPatch,
					fakeEvent({
						user: me,
						params,
						path: `/api/builds/${id}`,
						request: jsonReq('PATCH', `{"version":1,"story":"${'x'.repeat(1024 * 1024)}"}`)
					})
				)
			).status
		).toBe(413);
		await setPublished(id);
		expect(
			(
				await call(
					buildPatch,
					fakeEvent({
						user: asUser(other),
						params,
						path: `/api/builds/${id}`,
						request: jsonReq('PATCH', '{"version":1}')
					})
				)
			).status
		).toBe(403);
		expect(
			(await call(buildDelete, fakeEvent({ user: me, params, path: `/api/builds/${id}` }))).status
		).toBe(204);
		expect(
			(await call(buildGet, fakeEvent({ user: me, params, path: `/api/builds/${id}` }))).status
		).toBe(404);
	});

	it('a setup saved by its form takes a JSON PATCH of one field, keeping the rest', async () => {
		const owner = await makeUser();
		const b = await builds.create(owner.id, { title: 'Patch one field' });
		const s = (await saveSetup(b.id, { ...FIXTURE_SETUP, changeNote: 'Baseline' })) as {
			id: number;
		};
		const params = { id: String(b.id), setupId: String(s.id) };
		const path = `/api/builds/${b.id}/setups/${s.id}`;
		const patch = (body: string) =>
			call(
				setupPatch,
				fakeEvent({ user: asUser(owner), params, path, request: jsonReq('PATCH', body) })
			);
		// Before: a save through the API stores every empty optional number as null, and the next
		// PATCH merged those nulls in and failed its own schema ("Enter a number.") on each.
		for (const [version, jet] of [
			[0, 96],
			[1, 98]
		]) {
			const r = await patch(JSON.stringify({ version, mainJet: jet }));
			expect(r.status, await r.clone().text()).toBe(200);
		}
		const saved = (await models().Setup.findByPk(s.id))!;
		expect(saved.config.mainJet).toBe(98);
		expect(saved.config.carbBore).toBe(FIXTURE_SETUP.carbBore);
		expect((await patch('{"version":1,"mainJet":100}')).status).toBe(409);
	});

	it('photos: 413 over 15 MB, 415 for a text file named .jpg, 404 on a draft’s photo for others', async () => {
		const owner = await makeUser();
		const other = await makeUser();
		const b = await builds.create(owner.id, { title: 'Photo access' });
		const params = { id: String(b.id) };
		const upload = (bytes: Uint8Array, name: string) => {
			const fd = new FormData();
			fd.set('file', new File([bytes as Uint8Array<ArrayBuffer>], name, { type: 'image/jpeg' }));
			return call(
				photoPost,
				fakeEvent({
					user: asUser(owner),
					params,
					path: `/api/builds/${b.id}/photos`,
					request: { method: 'POST', body: fd }
				})
			);
		};
		expect(
			(await upload(new TextEncoder().encode('just words, not a picture'), 'notes.jpg')).status
		).toBe(415);
		expect((await upload(new Uint8Array(16 * 1024 * 1024), 'huge.jpg')).status).toBe(413);
		const png = await sharp({
			create: { width: 64, height: 48, channels: 3, background: '#a8471f' }
		})
			.png()
			.toBuffer();
		const ok = await upload(new Uint8Array(png), 'actually-a-png.jpg');
		expect(ok.status).toBe(201);
		expect((await ok.json()).sourceFormat).toBe('png');

		const photo = await addPhoto(b.id, new Uint8Array(png));
		const get = (user: ReturnType<typeof asUser> | null) =>
			call(
				photoGet,
				fakeEvent({
					user,
					params: { id: String(photo.id), size: 'display' },
					path: `/api/photos/${photo.id}/display`
				})
			).then(
				(r) => r.status,
				(e: { status: number }) => e.status
			);
		expect(await get(asUser(other))).toBe(404);
		expect(await get(null)).toBe(404);
		expect(await get(asUser(owner))).toBe(200);

		// Deleting the build deletes its photos' objects from the store.
		const keys = [photo.displayKey, photo.thumbKey];
		for (const k of keys) expect(await objectExists(k)).toBe(true);
		expect(
			(
				await call(
					buildDelete,
					fakeEvent({ user: asUser(owner), params, path: `/api/builds/${b.id}` })
				)
			).status
		).toBe(204);
		for (const k of keys) expect(await objectExists(k)).toBe(false);
	});
});

async function setPublished(id: number) {
	const b = (await builds.read(id))!;
	await builds.update(id, b.version, { publication: 'published', publishedAt: new Date() });
}
