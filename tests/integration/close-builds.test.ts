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
		const results = mine(
			(await closeBuilds(target, { cycle: 'four-stroke', limit: 5000 })).results
		);
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
			(await closeBuilds(onlyPipe, { cycle: 'four-stroke', limit: 5000 })).results
		);
		expect(results.map((r) => r.score)).toEqual([0, 0, 0, 2]);
		expect(results[3].buildId).toBe(ids.Q);
		const nothing = await closeBuilds(targetFrom({ cycle: 'four-stroke', limit: 10 }), {
			cycle: 'four-stroke',
			limit: 10
		});
		expect(nothing.results.every((r) => r.score === 0)).toBe(true);
	});

	it('makes two queries for the ranking, and one more from a build of its own', async () => {
		const spy = vi.spyOn(db(), 'query');
		try {
			const counts: number[] = [];
			for (const limit of [5, 50]) {
				spy.mockClear();
				const found = await closeBuilds(target, { cycle: 'two-stroke', limit });
				expect(found.results.length).toBeGreaterThan(0);
				counts.push(spy.mock.calls.length);
			}
			// The walks' boundaries, then the ranking.
			expect(counts).toEqual([2, 2]);
			// From a build of one's own: its setup is read first.
			spy.mockClear();
			const fromBuild = await searchClose(closeQuerySchema.parse({ build: ids.P }));
			expect(fromBuild.fromBuild).toBe(ids.P);
			expect(fromBuild.results.length).toBeGreaterThan(0);
			expect(fromBuild.results.every((r) => r.buildId !== ids.P)).toBe(true);
			expect(spy.mock.calls.length).toBe(3);
		} finally {
			spy.mockRestore();
		}
	});

	it('reads a bounded number of covering index entries, nearest the target first', async () => {
		// Two entries a walk and five with ties, so the demo data holds more than any walk may read.
		const saved = { ...BAND };
		BAND.perWalk = 2;
		BAND.ties = 5;
		const reads: { key: string; rows: number; covering: boolean; query: string }[] = [];
		try {
			for (const q of [
				{ cycle: 'two-stroke', cc: 68, exhaust: 'expansion-chamber', carb: 17, limit: 5 },
				{ cycle: 'two-stroke', cc: 68, carb: 17, limit: 5 },
				{ cycle: 'two-stroke', carb: 17, exhaust: 'sport', limit: 5 },
				{ cycle: 'two-stroke', carb: 17, limit: 5 }
			] as const) {
				const plan = await planClose(targetFrom(q), { cycle: 'two-stroke', limit: 5 });
				const [row] = await db().query<{ ANALYZE: string }>(`ANALYZE FORMAT=JSON ${plan.sql}`, {
					replacements: plan.replacements,
					type: QueryTypes.SELECT
				});
				for (const t of tablesIn(JSON.parse(Object.values(row)[0] as string)))
					if (t.table_name === 's')
						reads.push({
							key: t.key,
							// null where MariaDB never had to run that part
							rows: t.r_rows ?? 0,
							covering: t.using_index === true,
							query: JSON.stringify(q)
						});
			}
		} finally {
			Object.assign(BAND, saved);
		}
		// Displacement first: each way among the same pipe type, then among all; bore when no
		// displacement, a pair of walks per pipe type.
		const keys = [...new Set(reads.map((r) => r.key))].sort();
		expect(keys).toEqual([
			'setups_close_by_carb',
			'setups_close_by_exhaust',
			'setups_close_representative'
		]);
		// Each walk reads from the target up to its boundary (found by the query before); a walk
		// with nothing on its side reads nothing.
		expect(reads.length).toBeGreaterThan(4);
		expect(reads.length).toBeLessThanOrEqual(4 + 2 + 8 + 8);
		for (const r of reads) {
			expect(r.rows, r.query).toBeLessThanOrEqual(5);
			// The index entries alone: never the table rows.
			expect(r.covering, r.query).toBe(true);
		}
		expect(reads.some((r) => r.rows >= 2)).toBe(true);
	});

	it('ranks the newest listed setups when neither displacement nor bore is given, and says so', async () => {
		// A limit past the form's, so that copies of this fixture from earlier runs cannot crowd it out.
		const found = await closeBuilds(
			targetFrom({ cycle: 'four-stroke', exhaust: 'expansion-chamber', elevation: 200, limit: 10 }),
			{ cycle: 'four-stroke', limit: 5000 }
		);
		expect(found.comparedBy).toBe('newest');
		expect(found.bandCc).toBeNull();
		// Same pipe and elevation (R and P, equal: R differs only in its bore, not asked; the newer
		// first), then 1,200 m higher (S: 0.75 × 1.2), then another pipe type (Q: 2).
		expect(mine(found.results).map((r) => r.buildId)).toEqual([ids.R, ids.P, ids.S, ids.Q]);
		const byCc = await searchClose(closeQuerySchema.parse({ cycle: 'four-stroke', cc: 68.2 }));
		expect(byCc.comparedBy).toBe('cc');
		expect(byCc.bandCc).toBeGreaterThanOrEqual(0.2);
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
		const all = (await closeBuilds(target, { cycle: 'four-stroke', all: true, limit: 5000 }))
			.results;
		const cost = (setupId: number) => all.find((r) => r.setupId === setupId)?.partsMinor;
		expect(cost(stock.id)).toBe(0);
		expect(cost(kit.id)).toBe(38200);
		const rep = (await closeBuilds(target, { cycle: 'four-stroke', limit: 5000 })).results;
		expect(rep.find((r) => r.buildId === b.id)?.partsMinor).toBe(38200);
	});
});

type Access = { table_name?: string; key?: string; r_rows?: number; using_index?: boolean };
/** Every table access in MariaDB's ANALYZE FORMAT=JSON output, however deeply nested. */
function tablesIn(node: unknown): Required<Access>[] {
	if (!node || typeof node !== 'object') return [];
	const here = (node as { table?: Access }).table;
	const own = here?.table_name ? [here as Required<Access>] : [];
	return [...own, ...Object.values(node).flatMap((v) => tablesIn(v))];
}
