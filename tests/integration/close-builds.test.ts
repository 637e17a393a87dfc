import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { closeDb, db } from '../../src/lib/server/db/connection';
import * as builds from '../../src/lib/server/sheet/builds';
import { BAND } from '../../src/lib/close/weights';
import { closeBuilds, planClose, targetFrom } from '../../src/lib/server/close/service';
import { searchClose } from '../../src/lib/server/close/search';
import { closeQuerySchema } from '../../src/lib/schemas/close';
import { addPart, saveRun, saveSetup } from '../../src/lib/server/sheet/service';
import { setPublication } from '../../src/lib/server/sheet/build-service';
import { makeUser } from '../support/factories';
import { FIXTURE_SETUP, fixtureRun } from '../support/sheet-fixtures';

// A fixed set of four-stroke builds (the demo data is all two-stroke, so nothing else competes).
const BASE = FIXTURE_SETUP;
const run = (speed: number, elevation: number) => fixtureRun(speed, { elevation });
const ids: Record<string, number> = {};
// Only this file's fixture counts, should the database still hold one from an earlier run.
const mine = <T extends { buildId: number }>(rs: T[]) =>
	rs.filter((r) => Object.values(ids).includes(r.buildId));

beforeAll(async () => {
	const owner = await makeUser();
	const fixture: [string, Record<string, unknown>, number, number][] = [
		['P same as the target', {}, 95, 200],
		['Q sport silencer', { exhaustType: 'sport' }, 80, 200],
		['R stock 50 cc cylinder', { bore: 40 }, 70, 200],
		['S tuned up the hill', {}, 92, 1400]
	];
	for (const [title, change, speed, elevation] of fixture) {
		const b = await builds.create(owner.id, {
			title,
			engineCycle: 'four-stroke',
			chassis: 'fixture',
			engineFamily: 'fixture',
			brakeFront: 'disc',
			brakeRear: 'drum'
		});
		const { id } = (await saveSetup(b.id, { ...BASE, ...change } as never)) as { id: number };
		await saveRun(b.id, id, run(speed, elevation) as never);
		await setPublication((await builds.read(b.id))!, 'published');
		ids[title[0]] = b.id;
	}
});
afterAll(closeDb);

const target = targetFrom({
	cycle: 'four-stroke',
	cc: 68.0098,
	exhaust: 'expansion-chamber',
	carb: 17,
	tyre: '120/70-12',
	driver: 15,
	driven: 43,
	driver2: 13,
	driven2: 47,
	elevation: 200,
	limit: 10
});

describe('close builds', () => {
	it('ranks the fixed set in the order worked out by hand, with the reasons', async () => {
		// Hand-worked scores (weights in src/lib/close/weights.ts): P 0; S 0.75 × 1200/1000 = 0.9;
		// Q exhaust 2 × 1 = 2; R 3 × min(|49.26 − 68.01| / 10, 3) = 3 × 1.875 = 5.625.
		const results = mine((await closeBuilds(target, { cycle: 'four-stroke', limit: 50 })).results);
		expect(results.map((r) => r.buildId)).toEqual([ids.P, ids.S, ids.Q, ids.R]);
		expect(results.map((r) => Number(r.score.toFixed(3)))).toEqual([0, 0.9, 2, 5.625]);
		expect(results[0].reasons).toEqual([
			'same pipe type (expansion chamber)',
			'same size (68 cc)',
			'same final drive',
			'tuned at about the same elevation'
		]);
		expect(results[1].reasons).toContain('tuned 1,200 m higher');
		expect(results[2].reasons[0]).toBe('sport silencer instead of expansion chamber');
		expect(results[3].reasons).toContain('49 vs 68 cc');
		expect(results[0].bestKmh).toBe(95);
	});

	it('leaves empty fields out of the score', async () => {
		const onlyPipe = targetFrom({ cycle: 'four-stroke', exhaust: 'expansion-chamber', limit: 10 });
		const results = mine(
			(await closeBuilds(onlyPipe, { cycle: 'four-stroke', limit: 50 })).results
		);
		expect(results.map((r) => r.score)).toEqual([0, 0, 0, 2]);
		expect(results[3].buildId).toBe(ids.Q);
		const nothing = await closeBuilds(targetFrom({ cycle: 'four-stroke', limit: 10 }), {
			cycle: 'four-stroke',
			limit: 10
		});
		expect(nothing.results.every((r) => r.score === 0)).toBe(true);
	});

	it('makes at most three queries, however many bands it must try and results it gives', async () => {
		// A threshold no band can reach makes it try every band and both pipe choices: before, one
		// query each, in sequence (thirteen here), then the ranking and the details.
		const saved = BAND.minCandidates;
		BAND.minCandidates = 1_000_000;
		const spy = vi.spyOn(db(), 'query');
		try {
			const counts: number[] = [];
			for (const limit of [5, 50]) {
				spy.mockClear();
				const found = await closeBuilds(target, { cycle: 'two-stroke', limit });
				expect(found.results.length).toBeGreaterThan(0);
				counts.push(spy.mock.calls.length);
			}
			expect(counts).toEqual([2, 2]);
			// From a build of one's own: its setup is read first, the third query.
			spy.mockClear();
			const fromBuild = await searchClose(closeQuerySchema.parse({ build: ids.P }));
			expect(fromBuild.fromBuild).toBe(ids.P);
			expect(mine(fromBuild.results).length).toBeGreaterThan(0);
			expect(spy.mock.calls.length).toBe(3);
		} finally {
			BAND.minCandidates = saved;
			spy.mockRestore();
		}
	});

	it('ranks over a covering prefilter index, led by displacement or else by carburettor bore', async () => {
		// The demo data is small, so lower the threshold for this check: every band then holds enough.
		const saved = BAND.minCandidates;
		BAND.minCandidates = 1;
		const spy = vi.spyOn(db(), 'query');
		const plans: { key: string; Extra: string }[] = [];
		try {
			for (const q of [
				{ cycle: 'two-stroke', cc: 68, exhaust: 'expansion-chamber', carb: 17, limit: 5 },
				{ cycle: 'two-stroke', cc: 68, carb: 17, limit: 5 },
				{ cycle: 'two-stroke', carb: 17, exhaust: 'sport', limit: 5 },
				{ cycle: 'two-stroke', carb: 17, limit: 5 }
			] as const) {
				spy.mockClear();
				const ranking = await planClose(targetFrom(q), { cycle: 'two-stroke', limit: 5 });
				spy.mockClear();
				const [plan] = await db().query<{ key: string; Extra: string }>(`EXPLAIN ${ranking.sql}`, {
					replacements: ranking.replacements,
					type: QueryTypes.SELECT
				});
				plans.push(plan);
			}
		} finally {
			BAND.minCandidates = saved;
			spy.mockRestore();
		}
		expect(plans.map((p) => p.key)).toEqual([
			'setups_close_by_exhaust',
			'setups_close_representative',
			'setups_close_by_carb',
			'setups_close_by_carb'
		]);
		// "Using index": the ranking reads index entries only, never the table rows.
		for (const p of plans) expect(p.Extra.split('; ')).toContain('Using index');
	});

	it('prices each setup by the parts fitted up to it, never the whole build', async () => {
		// Stock 50 cc baseline at 50.7 km/h, then a kit (€300.00, fitted in setup 2) at 90 km/h; a
		// €82.00 part tied to no setup counts on the representative setup only.
		const owner = await makeUser();
		const b = await builds.create(owner.id, {
			title: 'Priced by the step',
			engineCycle: 'four-stroke',
			chassis: 'fixture',
			engineFamily: 'fixture',
			brakeFront: 'disc',
			brakeRear: 'drum'
		});
		const stock = (await saveSetup(b.id, {
			...BASE,
			changeNote: 'Stock baseline',
			isStock: true,
			bore: 40
		} as never)) as { id: number };
		await saveRun(b.id, stock.id, run(50.7, 200) as never);
		const kit = (await saveSetup(b.id, { ...BASE, changeNote: '70 cc kit' } as never)) as {
			id: number;
		};
		await saveRun(b.id, kit.id, run(90, 200) as never);
		await addPart(b.id, { category: 'cylinder', name: 'Kit', cost: 300, setupId: kit.id });
		await addPart(b.id, { category: 'tools', name: 'Feeler gauges', cost: 82, setupId: null });
		await setPublication((await builds.read(b.id))!, 'published');
		const all = (await closeBuilds(target, { cycle: 'four-stroke', all: true, limit: 50 })).results;
		const cost = (setupId: number) => all.find((r) => r.setupId === setupId)?.partsMinor;
		expect(cost(stock.id)).toBe(0);
		expect(cost(kit.id)).toBe(38200);
		const rep = (await closeBuilds(target, { cycle: 'four-stroke', limit: 50 })).results;
		expect(rep.find((r) => r.buildId === b.id)?.partsMinor).toBe(38200);
	});
});
