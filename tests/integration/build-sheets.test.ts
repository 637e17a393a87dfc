import { afterAll, describe, expect, it } from 'vitest';
import * as t from '../../src/lib/tuning';
import { closeDb } from '../../src/lib/server/db/connection';
import * as builds from '../../src/lib/server/sheet/builds';
import { models } from '../../src/lib/server/db/models';
import { renderMarkdown } from '../../src/lib/server/text/markdown';
import { saveRun, saveSetup } from '../../src/lib/server/sheet/service';
import { setPublication } from '../../src/lib/server/sheet/build-service';
import { buildPage } from '../../src/lib/server/pages/build-page';
import { load as viewLoad } from '../../src/routes/builds/[id=id]/+page.server';
import {
	actions as editActions,
	load as editLoad
} from '../../src/routes/builds/[id=id]/edit/+page.server';
import { asUser, fakeEvent } from '../support/events';
import { makeUser } from '../support/factories';

afterAll(closeDb);

const SETUP = {
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
	topCvtRatio: 0.95,
	primaryDriver: 13,
	primaryDriven: 43,
	secondaryDriver: 13,
	secondaryDriven: 47,
	rearTyre: '120/70-12 51J',
	peakRpm: 7000,
	lubrication: 'premix',
	kitMaterial: 'cast-iron'
};
const RUN = {
	runOn: '2026-05-01',
	speed: 50,
	method: 'gps-logger',
	twoWay: true,
	venue: 'closed-course',
	elevation: 1200,
	temp: 20,
	humidity: 50,
	pressure: null,
	pressureKind: 'sea-level',
	chtSensor: 'plug-washer',
	notes: ''
};

async function draftBuild(ownerId: string) {
	return builds.create(ownerId, {
		title: 'Integration build',
		chassis: 'Test frame',
		engineFamily: 'test engine',
		brakeFront: 'disc',
		brakeRear: 'drum'
	});
}

const status = async (p: unknown) =>
	Promise.resolve(p).then(
		() => 200,
		(e: { status?: number }) => e.status ?? 500
	);

describe('who may see and change a build', () => {
	it('another member gets 404 on a draft and 403 on editing a published build', async () => {
		const owner = await makeUser();
		const other = await makeUser();
		const b = await draftBuild(owner.id);
		const params = { id: String(b.id) };
		expect(
			await status(viewLoad(fakeEvent({ user: asUser(other), params, path: `/builds/${b.id}` })))
		).toBe(404);
		expect(await status(viewLoad(fakeEvent({ user: null, params, path: `/builds/${b.id}` })))).toBe(
			404
		);
		expect(
			await status(viewLoad(fakeEvent({ user: asUser(owner), params, path: `/builds/${b.id}` })))
		).toBe(200);
		expect(
			await status(
				editLoad(fakeEvent({ user: asUser(other), params, path: `/builds/${b.id}/edit` }))
			)
		).toBe(404);

		await saveSetup(b.id, SETUP);
		await setPublication((await builds.read(b.id))!, 'published');
		expect(
			await status(viewLoad(fakeEvent({ user: asUser(other), params, path: `/builds/${b.id}` })))
		).toBe(200);
		expect(
			await status(
				editLoad(fakeEvent({ user: asUser(other), params, path: `/builds/${b.id}/edit` }))
			)
		).toBe(403);
		expect(
			await status(
				editLoad(fakeEvent({ user: asUser(other, 'admin'), params, path: `/builds/${b.id}/edit` }))
			)
		).toBe(200);
		const save = editActions.save(
			fakeEvent({
				user: asUser(other),
				params,
				path: `/builds/${b.id}/edit`,
				form: { title: 'Hijacked', units: 'metric', version: '0' }
			})
		);
		expect(await status(save)).toBe(403);
		expect((await builds.read(b.id))!.title).toBe('Integration build');
	});

	it('a stale version gets the conflict, with the unsaved input kept', async () => {
		const owner = await makeUser();
		const b = await draftBuild(owner.id);
		const params = { id: String(b.id) };
		const form = (title: string, version: number) => ({
			title,
			chassis: 'Test frame',
			units: 'metric',
			version: String(version),
			engineCycle: 'two-stroke',
			cooling: 'air',
			cylinderOrientation: 'horizontal',
			currency: 'EUR'
		});
		const first = await editActions.save(
			fakeEvent({
				user: asUser(owner),
				params,
				path: `/builds/${b.id}/edit`,
				form: form('First tab', b.version)
			})
		);
		expect((first as { form: { valid: boolean } }).form.valid).toBe(true);
		const second = (await editActions.save(
			fakeEvent({
				user: asUser(owner),
				params,
				path: `/builds/${b.id}/edit`,
				form: form('Second tab', b.version)
			})
		)) as { status: number; data: { form: { data: { title: string }; message: string } } };
		expect(second.status).toBe(409);
		expect(second.data.form.data.title).toBe('Second tab');
		expect(second.data.form.message).toMatch(/Someone saved this sheet/);
		expect((await builds.read(b.id))!.title).toBe('First tab');
	});
});

describe('Markdown stories', () => {
	it('a script payload renders harmless', async () => {
		const evil =
			'# Hi\n\n<script>alert(1)</script><img src=x onerror="alert(2)">\n\n[click](javascript:alert(3)) <iframe src="https://x.example"></iframe> **bold**';
		const html = renderMarkdown(evil);
		expect(html).not.toMatch(/<script|onerror|href="javascript:|<iframe/i);
		expect(html).toContain('<h1>Hi</h1>');
		expect(html).toContain('<strong>bold</strong>');
		const owner = await makeUser();
		const b = await builds.create(owner.id, { title: 'Story test', story: evil });
		expect((await buildPage(b, null, 'metric', new Date())).build.storyHtml).not.toMatch(
			/<script|onerror|href="javascript:/i
		);
	});
});

describe('derived columns', () => {
	it('match the tuning module after an edit', async () => {
		const owner = await makeUser();
		const b = await draftBuild(owner.id);
		const { id } = (await saveSetup(b.id, SETUP)) as { id: number };
		await saveRun(b.id, id, RUN);
		const before = (await models().Setup.findByPk(id))!;
		const edited = {
			...SETUP,
			bore: 47,
			primaryDriver: 15,
			topCvtRatio: 0.82,
			rearTyre: '130/60-13 53P',
			rollerWeights: '3x5.0 + 3x4.5',
			peakRpm: 10500,
			mainJet: 94
		};
		expect(await saveSetup(b.id, edited, { id, version: before.version })).toEqual({ id });
		const s = (await models().Setup.findByPk(id))!;
		const stages: t.GearStage[] = [
			[15, 43],
			[13, 47]
		];
		expect(s.displacementCc).toBeCloseTo(t.displacementCc(47, 39.2), 9);
		expect(s.finalDriveRatio).toBeCloseTo(t.finalDriveRatio(stages), 9);
		expect(s.overallRatio).toBeCloseTo(t.overallReduction(0.82, stages), 9);
		expect(s.tyreCircumferenceMm).toBeCloseTo(t.tyreCircumferenceMm('130/60-13 53P'), 9);
		expect(s.rollerTotalG).toBeCloseTo(28.5, 9);
		expect(s.gearingLimitKmh).toBeCloseTo(
			t.gearingLimitedSpeedKmh(10500, 0.82, stages, '130/60-13 53P'),
			9
		);
		const air = {
			elevationM: 1200,
			tempC: 20,
			relativeHumidity: 0.5,
			pressureKind: 'sea-level' as const
		};
		expect(s.seaLevelJet).toBeCloseTo(t.seaLevelEquivalentJet(94, air), 9);
		const run = (await models().Run.findOne({ where: { setupId: id } }))!;
		expect(run.airDensity).toBeCloseTo(t.airAt(air).densityKgM3, 9);
		expect(s.bestRunKmh).toBe(50);
		// The old version number is now stale.
		await expect(saveSetup(b.id, SETUP, { id, version: before.version })).rejects.toMatchObject({
			status: 409
		});
	});
});

describe('seeded demo builds', () => {
	it('at least 60, and every run at or below its setup’s gearing limit', async () => {
		const { Build, Run, Setup } = models();
		expect(await Build.count()).toBeGreaterThanOrEqual(60);
		const runs = await Run.findAll({ attributes: ['id', 'speedKmh', 'setupId'] });
		const setups = new Map(
			(await Setup.findAll({ attributes: ['id', 'gearingLimitKmh'] })).map((s) => [
				s.id,
				s.gearingLimitKmh
			])
		);
		const seeded = runs.filter((r) => setups.get(r.setupId) !== null);
		expect(seeded.length).toBeGreaterThan(100);
		for (const r of seeded)
			expect(r.speedKmh, `run ${r.id}`).toBeLessThanOrEqual(setups.get(r.setupId)!);
	});
});
