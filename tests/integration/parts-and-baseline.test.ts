import { afterAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/lib/server/db/connection';
import * as builds from '../../src/lib/server/sheet/builds';
import * as parts from '../../src/lib/server/sheet/parts';
import { addPart, saveSetup, updatePart } from '../../src/lib/server/sheet/service';
import { publishProblems } from '../../src/lib/server/sheet/build-service';
import { PUT as partPut } from '../../src/routes/api/builds/[id=id]/parts/[partId=id]/+server';
import { asUser, fakeEvent } from '../support/events';
import { makeUser } from '../support/factories';
import { FIXTURE_SETUP } from '../support/sheet-fixtures';

afterAll(closeDb);

const sheet = (ownerId: string) =>
	builds.create(ownerId, {
		title: 'Parts and baseline',
		chassis: 'fixture',
		engineFamily: 'fixture',
		brakeFront: 'disc',
		brakeRear: 'drum'
	});

describe('a stock baseline without the head off', () => {
	it('publishes without squish or cylinder material; a later setup still needs them', async () => {
		const u = await makeUser();
		const b = await sheet(u.id);
		const untouched: Record<string, string | number | boolean | null> = { ...FIXTURE_SETUP };
		delete untouched.squish;
		delete untouched.kitMaterial;
		await saveSetup(b.id, { ...untouched, changeNote: 'Stock baseline', isStock: true });
		expect(await publishProblems((await builds.read(b.id))!)).toEqual([]);
		await saveSetup(b.id, { ...untouched, changeNote: '70 cc kit', isStock: false });
		expect(await publishProblems((await builds.read(b.id))!)).toEqual([
			'Setup 2 (70 cc kit): Cylinder material',
			'Setup 2 (70 cc kit): Squish clearance'
		]);
	});
});

describe('editing a part', () => {
	it('changes it in place and the build total follows, by the form’s service and the JSON route', async () => {
		const u = await makeUser();
		const b = await sheet(u.id);
		const { id: setupId } = (await saveSetup(b.id, FIXTURE_SETUP)) as { id: number };
		await addPart(b.id, { category: 'exhaust', name: 'Pipe', cost: 100, setupId: null });
		const [p] = await parts.listForBuild(b.id);
		await updatePart(b.id, p.id, {
			category: 'exhaust',
			name: 'Pipe, ported',
			cost: 120.5,
			setupId
		});
		const again = (await parts.read(b.id, p.id))!;
		expect([again.name, again.costMinor, again.setupId]).toEqual(['Pipe, ported', 12050, setupId]);
		expect((await builds.read(b.id))!.partsTotalMinor).toBe(12050);

		const res = (await partPut(
			fakeEvent({
				user: asUser(u),
				params: { id: String(b.id), partId: String(p.id) },
				request: {
					method: 'PUT',
					body: JSON.stringify({ category: 'exhaust', name: 'Pipe', cost: 90, setupId: null }),
					headers: { 'content-type': 'application/json' }
				}
			}) as never
		)) as Response;
		expect(res.status).toBe(200);
		expect((await builds.read(b.id))!.partsTotalMinor).toBe(9000);
		// Another build's part is not this build's to change.
		const other = await sheet(u.id);
		await expect(
			updatePart(other.id, p.id, { category: 'exhaust', name: 'x1', cost: 1, setupId: null })
		).rejects.toMatchObject({ status: 404 });
		expect((await parts.read(b.id, p.id))!.name).toBe('Pipe');
	});
});
