import { randomUUID } from 'node:crypto';
import { Op } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { closeDb, db } from '../../src/lib/server/db/connection';
import { models } from '../../src/lib/server/db/models';
import {
	catalogue,
	findScooters,
	readScooter,
	scooterBuilds,
	SCOOTER_PAGE
} from '../../src/lib/server/scooters/catalogue';
import { setHidden } from '../../src/lib/server/review/items';
import { createBuild, destroyBuild } from '../../src/lib/server/sheet/build-service';
import { newSetupValues } from '../../src/lib/server/sheet/service';
import { decideProposal, proposeScooter } from '../../src/lib/server/scooters/proposals';
import { proposeScooterSchema } from '../../src/lib/schemas/scooters';
import { POST as buildsPost } from '../../src/routes/api/builds/+server';
import { stockGearingLimitKmh } from '../../src/lib/scooters/catalogue';
import { GET as listApi } from '../../src/routes/api/scooters/+server';
import { GET as oneApi } from '../../src/routes/api/scooters/[id=id]/+server';
import { asUser, fakeEvent } from '../support/events';
import { makeUser } from '../support/factories';
import { publishedBuild } from '../support/moderation-fixtures';

// The catalogue of base scooters: who sees which entry, the typo-tolerant search, a scooter's
// published builds, and the JSON API over them. Fixtures carry a word of their own so the demo
// catalogue never decides a result.

const tag = randomUUID().slice(0, 6);
let familyId = 0;
let listedId = 0;
let proposedId = 0;
let proposer: { id: string; email: string };
let owner: { id: string; email: string };
const buildIds: number[] = [];

beforeAll(async () => {
	const { EngineFamily, BaseScooter } = models();
	const f = await EngineFamily.create({
		name: `Fixture ${tag} 1E41`,
		engineCycle: 'two-stroke',
		cooling: 'air',
		cylinderOrientation: 'horizontal',
		boreMm: 40,
		strokeMm: 39.2
	});
	familyId = f.id;
	const common = {
		engineFamilyId: f.id,
		carbBoreMm: 12,
		primaryDriver: 13,
		primaryDriven: 42,
		secondaryDriver: 13,
		secondaryDriven: 46,
		cvtLowRatio: 2.6,
		cvtTopRatio: 0.97,
		rollerCount: 6,
		rollerWeightG: 6,
		rearTyre: '120/70-12 51L',
		peakRpm: 7000
	};
	listedId = (
		await BaseScooter.create({
			...common,
			maker: `Wendle${tag}`,
			model: 'Skylark 50',
			yearFrom: 2015,
			yearTo: 2021
		})
	).id;
	proposer = await makeUser();
	owner = await makeUser();
	proposedId = (
		await BaseScooter.create({
			...common,
			maker: `Wendle${tag}`,
			model: 'Skylark 50 LC',
			yearFrom: 2022,
			state: 'proposed',
			proposedBy: proposer.id
		})
	).id;
	for (let i = 0; i < SCOOTER_PAGE + 3; i++) {
		const { build } = await publishedBuild(owner.id, `Scooter fixture ${tag} ${i}`);
		await models().Build.update({ baseScooterId: listedId }, { where: { id: build.id } });
		buildIds.push(build.id);
	}
});

afterAll(async () => {
	for (const id of buildIds) await destroyBuild(id);
	await models().BaseScooter.destroy({ where: { engineFamilyId: familyId } });
	await models().EngineFamily.destroy({ where: { id: familyId } });
	await closeDb();
});

describe('the catalogue', () => {
	it('gives each family its displacement from bore and stroke', async () => {
		const s = await readScooter(listedId);
		// V = π/4 · B² · S (cylinder geometry, REFERENCES.md "Engine"): 40 mm × 39.2 mm → 49.26 cc.
		expect(s.family.displacementCc).toBeCloseTo(((Math.PI / 4) * 40 * 40 * 39.2) / 1000, 6);
		expect(s.family.displacementCc).toBeCloseTo(49.26, 2);
		expect(s.finalDrive).toEqual([
			[13, 42],
			[13, 46]
		]);
	});

	it('works out what the stock gearing allows at the power peak', async () => {
		const s = await readScooter(listedId);
		// By hand: tyre 120/70-12 → D = 25.4·12 + 2·120·0.70 = 472.8 mm (ETRTO sizing, REFERENCES.md
		// "Road speed"), circumference π·D = 1485.3 mm; overall 0.97 · 42/13 · 46/13 = 11.089;
		// 7000 rpm / 11.089 · 1.4853 m · 60 / 1000 = 56.25 km/h.
		expect(stockGearingLimitKmh(s)).toBeCloseTo(56.25, 1);
	});

	it('finds a scooter by a misspelt name, best match first', async () => {
		const found = await findScooters(`Wendle${tag} Skylrak`);
		expect(found[0]?.id).toBe(listedId);
		expect(await findScooters(`zzqx${tag}qq`)).toEqual([]);
	});

	it('shows a proposed entry to its proposer and the moderators only', async () => {
		const ids = async (viewer: Parameters<typeof catalogue>[0]) =>
			(await catalogue(viewer)).map((s) => s.id);
		expect(await ids(null)).toContain(listedId);
		expect(await ids(null)).not.toContain(proposedId);
		expect(await ids({ id: owner.id, role: 'member' })).not.toContain(proposedId);
		expect(await ids({ id: proposer.id, role: 'member' })).toContain(proposedId);
		await expect(readScooter(proposedId)).rejects.toMatchObject({ status: 404 });
		await expect(readScooter(proposedId, { id: owner.id, role: 'member' })).rejects.toMatchObject({
			status: 404
		});
		expect((await readScooter(proposedId, { id: owner.id, role: 'moderator' })).state).toBe(
			'proposed'
		);
		expect((await readScooter(proposedId, { id: proposer.id, role: 'member' })).id).toBe(
			proposedId
		);
	});
});

describe('a scooter’s builds', () => {
	it('lists the published ones newest first, a page at a time with no overlap, in two queries', async () => {
		const spy = vi.spyOn(db(), 'query');
		let first;
		try {
			first = await scooterBuilds(listedId);
			expect(spy.mock.calls.length).toBe(2);
		} finally {
			spy.mockRestore();
		}
		const newest = [...buildIds].sort((a, b) => b - a);
		expect(first.builds.map((b) => b.id)).toEqual(newest.slice(0, SCOOTER_PAGE));
		expect(first.next).toBe(newest[SCOOTER_PAGE - 1]);
		const second = await scooterBuilds(listedId, first.next);
		expect(second.builds.map((b) => b.id)).toEqual(newest.slice(SCOOTER_PAGE));
		expect(second.next).toBeNull();
	});

	it('leaves a hidden build out', async () => {
		const hidden = buildIds[0];
		await setHidden({ type: 'build', id: hidden }, 'test');
		try {
			const all = [
				...(await scooterBuilds(listedId)).builds,
				...(await scooterBuilds(listedId, (await scooterBuilds(listedId)).next)).builds
			];
			expect(all.map((b) => b.id)).not.toContain(hidden);
		} finally {
			await setHidden({ type: 'build', id: hidden }, null);
		}
	});
});

describe('the JSON API', () => {
	it('answers the catalogue and one scooter, and 404 for a proposal it may not see', async () => {
		const list = await listApi(fakeEvent({ path: `/api/scooters?q=Wendle${tag}` }));
		expect(list.status).toBe(200);
		const body = (await list.json()) as { scooters: { id: number }[] };
		expect(body.scooters.map((s) => s.id)).toEqual([listedId]);

		const one = await oneApi(
			fakeEvent({ path: `/api/scooters/${listedId}`, params: { id: String(listedId) } })
		);
		expect(one.status).toBe(200);
		const got = (await one.json()) as {
			scooter: { id: number };
			builds: unknown[];
			next: number | null;
		};
		expect(got.scooter.id).toBe(listedId);
		expect(got.builds).toHaveLength(SCOOTER_PAGE);
		expect(got.next).not.toBeNull();

		const hiddenFromOthers = await oneApi(
			fakeEvent({
				path: `/api/scooters/${proposedId}`,
				params: { id: String(proposedId) },
				user: asUser(owner)
			})
		);
		expect(hiddenFromOthers.status).toBe(404);
		const bad = await oneApi(
			fakeEvent({
				path: `/api/scooters/${listedId}?before=x`,
				params: { id: String(listedId) }
			})
		);
		expect(bad.status).toBe(422);
	});
});

describe('starting a build from a scooter', () => {
	it('keeps the scooter a member picks: a listed one or their own proposal, nothing else', async () => {
		const listed = await createBuild(owner.id, { title: `From the catalogue ${tag}` }, listedId);
		buildIds.push(listed.id);
		expect(listed.baseScooterId).toBe(listedId);
		const own = await createBuild(proposer.id, { title: `From my proposal ${tag}` }, proposedId);
		buildIds.push(own.id);
		expect(own.baseScooterId).toBe(proposedId);
		const before = await models().Build.count({ where: { ownerId: owner.id } });
		await expect(
			createBuild(owner.id, { title: `From another's proposal ${tag}` }, proposedId)
		).rejects.toMatchObject({ status: 422, issues: [{ path: 'baseScooterId' }] });
		await expect(
			createBuild(owner.id, { title: `From nothing ${tag}` }, 987654321)
		).rejects.toMatchObject({ status: 422 });
		// Refused before anything was written.
		expect(await models().Build.count({ where: { ownerId: owner.id } })).toBe(before);
	});

	it('fills the stock baseline setup in from the catalogue', async () => {
		const b = await createBuild(owner.id, { title: `Prefilled ${tag}` }, listedId);
		buildIds.push(b.id);
		expect(await newSetupValues(b)).toEqual({
			changeNote: 'Stock baseline',
			isStock: true,
			exhaustType: 'stock',
			restrictorRemoved: false,
			bore: 40,
			stroke: 39.2,
			carbBore: 12,
			topCvtRatio: 0.97,
			rollerWeights: '6x6',
			primaryDriver: 13,
			primaryDriven: 42,
			secondaryDriver: 13,
			secondaryDriven: 46,
			rearTyre: '120/70-12 51L',
			peakRpm: 7000
		});
		// Without a scooter, only what a stock baseline always is.
		const bare = await createBuild(owner.id, { title: `Bare ${tag}` });
		buildIds.push(bare.id);
		expect(await newSetupValues(bare)).toEqual({
			changeNote: 'Stock baseline',
			isStock: true,
			exhaustType: 'stock'
		});
	});

	it('takes the scooter over the JSON API too', async () => {
		const post = (body: unknown) =>
			buildsPost(
				fakeEvent({
					path: '/api/builds',
					user: asUser(owner),
					request: {
						method: 'POST',
						body: JSON.stringify(body),
						headers: { 'content-type': 'application/json' }
					}
				})
			);
		const ok = await post({ title: `API start ${tag}`, baseScooterId: listedId });
		expect(ok.status).toBe(201);
		const { id } = (await ok.json()) as { id: number };
		buildIds.push(id);
		expect((await models().Build.findByPk(id))!.baseScooterId).toBe(listedId);
		const refused = await post({ title: `API refused ${tag}`, baseScooterId: proposedId });
		expect(refused.status).toBe(422);
		expect(((await refused.json()) as { issues: { path: string }[] }).issues[0].path).toBe(
			'baseScooterId'
		);
	});
});

describe('proposals and the desk', () => {
	const proposal = (model: string, extra: Record<string, string> = {}) =>
		proposeScooterSchema.parse({
			maker: `Prop${tag}`,
			model,
			yearFrom: '2016',
			familyName: `Prop${tag} ${model} engine`,
			engineCycle: 'four-stroke',
			cooling: 'air',
			cylinderOrientation: 'horizontal',
			boreMm: '52.4',
			strokeMm: '57.8',
			carbBoreMm: '24',
			...extra
		});
	const families = () =>
		models().EngineFamily.count({ where: { name: { [Op.like]: `Prop${tag}%` } } });
	const scooters = () => models().BaseScooter.count({ where: { maker: `Prop${tag}` } });

	afterAll(async () => {
		const { BaseScooter, EngineFamily } = models();
		await models().Build.update({ baseScooterId: null }, { where: { ownerId: proposer.id } });
		await BaseScooter.destroy({ where: { maker: `Prop${tag}` } });
		await EngineFamily.destroy({ where: { name: { [Op.like]: `Prop${tag}%` } } });
	});

	it('adds a proposal with its new engine in one transaction, or nothing', async () => {
		const me = asUser(proposer);
		const spy = vi
			.spyOn(models().BaseScooter, 'create')
			.mockRejectedValueOnce(new Error('injected after the family was written'));
		await expect(proposeScooter(me, proposal('Half'))).rejects.toThrow('injected');
		spy.mockRestore();
		expect(await families()).toBe(0);
		expect(await scooters()).toBe(0);

		const id = await proposeScooter(me, proposal('Whole'));
		expect(await families()).toBe(1);
		const s = await readScooter(id, { id: proposer.id, role: 'member' });
		expect(s.state).toBe('proposed');
		// 52.4 × 57.8 mm: V = π/4 · B² · S = 124.65 cc (REFERENCES.md "Engine").
		expect(s.family.displacementCc).toBeCloseTo(124.65, 2);
		// The same scooter twice: refused, nothing more written.
		await expect(
			proposeScooter(me, proposal('Whole', { familyName: `Prop${tag} other engine` }))
		).rejects.toMatchObject({ status: 409 });
		expect(await families()).toBe(1);
		expect(await scooters()).toBe(1);
	});

	it('lists an accepted one for everyone and logs the decision; a declined one is usable by nobody', async () => {
		const me = asUser(proposer);
		const moderator = asUser(await makeUser({ role: 'moderator' }), 'moderator');
		const accepted = await proposeScooter(me, proposal('Taken'));
		const declined = await proposeScooter(me, proposal('Refused'));
		const at = new Date();

		// The log refuses the line: the decision is not half made.
		const spy = vi
			.spyOn(models().LogEntry, 'create')
			.mockRejectedValueOnce(new Error('injected log failure'));
		await expect(
			decideProposal(moderator, { scooterId: accepted, decision: 'accept', reason: '' }, at)
		).rejects.toThrow('injected');
		spy.mockRestore();
		expect((await models().BaseScooter.findByPk(accepted))!.state).toBe('proposed');

		await decideProposal(
			moderator,
			{ scooterId: accepted, decision: 'accept', reason: 'checked the maker’s sheet' },
			at
		);
		expect((await catalogue(null)).map((s) => s.id)).toContain(accepted);
		const line = await models().LogEntry.findOne({
			where: { itemType: 'scooter', itemId: accepted }
		});
		expect(line?.action).toBe('scooter-accept');
		expect(line?.actorId).toBe(moderator.id);
		expect(line?.subjectId).toBe(proposer.id);
		await expect(
			decideProposal(moderator, { scooterId: accepted, decision: 'decline', reason: 'x' }, at)
		).rejects.toMatchObject({ status: 409 });

		await decideProposal(
			moderator,
			{ scooterId: declined, decision: 'decline', reason: 'a duplicate' },
			at
		);
		expect((await catalogue(me)).map((s) => s.id)).not.toContain(declined);
		await expect(
			createBuild(proposer.id, { title: `From a declined one ${tag}` }, declined)
		).rejects.toMatchObject({ status: 422 });
	});
});
