import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CurrentUser } from '../../src/lib/server/auth/current-user';
import { closeDb } from '../../src/lib/server/db/connection';
import { models } from '../../src/lib/server/db/models';
import {
	deleteCard,
	listCards,
	listRunPlaces,
	MAX_CARDS,
	saveCard
} from '../../src/lib/server/riding/places';
import { Failure } from '../../src/lib/failure';
import { asUser } from '../support/events';
import { makeUser } from '../support/factories';
import { publishedBuild } from '../support/moderation-fixtures';

let me: CurrentUser;
let other: CurrentUser;

beforeAll(async () => {
	me = asUser(await makeUser(), 'member');
	other = asUser(await makeUser(), 'member');
});
afterAll(closeDb);

const refusal = async (p: Promise<unknown>) => {
	try {
		await p;
	} catch (e) {
		if (e instanceof Failure) return { status: e.status, issues: e.issues };
		throw e;
	}
	throw new Error('expected a refusal');
};

describe('riding-conditions cards', () => {
	it('keeps a place in SI whatever units it was typed in', async () => {
		// 3,000 ft = 914.4 m; 86 °F = 30 °C; 29.92 inHg = 1013.2 hPa (NIST SP 811 factors).
		const c = await saveCard(me, {
			name: 'Hill track',
			units: 'imperial',
			elevation: '3000',
			temp: '86',
			humidity: '40',
			pressure: '29.92',
			pressureKind: 'sea-level'
		});
		expect(c.elevationM).toBeCloseTo(914.4, 6);
		expect(c.tempC).toBeCloseTo(30, 9);
		expect(c.pressureKpa).toBeCloseTo(101.32, 2);
		expect((await listCards(me)).map((x) => x.name)).toEqual(['Hill track']);
	});

	it('a name already kept is replaced, not doubled (names compare without case)', async () => {
		await saveCard(me, {
			name: 'hill TRACK',
			units: 'metric',
			elevation: 500,
			temp: 20,
			humidity: 50
		});
		const cards = await listCards(me);
		expect(cards).toHaveLength(1);
		expect(cards[0]).toMatchObject({ name: 'hill TRACK', elevationM: 500, pressureKpa: null });
	});

	it('names the field at fault, in the units typed', async () => {
		const r = await refusal(
			saveCard(me, { name: 'Too hot', units: 'metric', elevation: 0, temp: 75, humidity: 50 })
		);
		expect(r).toEqual({
			status: 422,
			issues: [{ path: 'temp', message: 'Must be between −40 and 60 °C.' }]
		});
		expect((await refusal(saveCard(me, { name: '', units: 'metric' }))).status).toBe(422);
	});

	it(`keeps at most ${MAX_CARDS} a member`, async () => {
		const many = asUser(await makeUser(), 'member');
		for (let i = 0; i < MAX_CARDS; i++)
			await saveCard(many, {
				name: `Place ${i}`,
				units: 'metric',
				elevation: i,
				temp: 15,
				humidity: 50
			});
		const r = await refusal(
			saveCard(many, { name: 'One more', units: 'metric', elevation: 0, temp: 15, humidity: 50 })
		);
		expect(r.status).toBe(409);
		// Replacing one by its name still works at the limit.
		await saveCard(many, {
			name: 'Place 3',
			units: 'metric',
			elevation: 33,
			temp: 15,
			humidity: 50
		});
		expect((await listCards(many)).find((c) => c.name === 'Place 3')!.elevationM).toBe(33);
	});

	it('only its owner removes a card; for anyone else it does not exist', async () => {
		const [card] = await listCards(me);
		expect((await refusal(deleteCard(other, card.id))).status).toBe(404);
		await deleteCard(me, card.id);
		expect(await listCards(me)).toEqual([]);
		expect((await refusal(deleteCard(me, card.id))).status).toBe(404);
	});

	it('goes with the account', async () => {
		const gone = await makeUser();
		await saveCard(asUser(gone, 'member'), {
			name: 'X',
			units: 'metric',
			elevation: 0,
			temp: 15,
			humidity: 0
		});
		await models().User.destroy({ where: { id: gone.id } });
		expect(await models().RidingConditions.count({ where: { userId: gone.id } })).toBe(0);
	});
});

describe('logged runs as places', () => {
	it('lists the member’s own runs with their air and the jet they ran, nobody else’s', async () => {
		const { build } = await publishedBuild(me.id, 'Runs as places');
		const mine = await listRunPlaces(me);
		expect(mine.length).toBeGreaterThan(0);
		expect(mine.every((r) => r.label.startsWith('Runs as places'))).toBe(true);
		const run = await models().Run.findOne({ where: { buildId: build.id } });
		expect(mine[0]).toMatchObject({ id: run!.id, elevationM: run!.elevationM, tempC: run!.tempC });
		expect((await listRunPlaces(other)).some((r) => r.id === run!.id)).toBe(false);
	});
});
