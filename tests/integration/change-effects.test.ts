import { quantile } from 'd3-array';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import * as builds from '../../src/lib/server/sheet/builds';
import { closeDb, db } from '../../src/lib/server/db/connection';
import { models } from '../../src/lib/server/db/models';
import { saveRun, saveSetup } from '../../src/lib/server/sheet/service';
import { setPublication } from '../../src/lib/server/sheet/build-service';
import {
	newestSteps,
	pairsFor,
	stepsOf,
	summarise
} from '../../src/lib/server/stats/change-effects';
import { makeUser } from '../support/factories';
import { FIXTURE_SETUP, fixtureRun, type FixtureAir } from '../support/sheet-fixtures';

// One fixed sheet whose steps each test one pairing rule; the expected verdicts are worked out by
// hand from the rules in src/lib/sheet/change-kinds.ts.
const BASE = { ...FIXTURE_SETUP };
const run = fixtureRun;
type Air = FixtureAir;
// [what changed, the change, the run (speed, air) or null for no run]
const STEPS: [string, Record<string, unknown>, [number, Air] | null][] = [
	['baseline', {}, [100, {}]],
	['one tooth up on the primary', { primaryDriver: 16 }, [104, {}]], // counts: final drive +4
	['jet and clip together', { mainJet: 94, needleClip: 3 }, [105, {}]], // mixed
	['lighter rollers, radar', { rollerWeights: '6x4.5' }, [106, { method: 'radar' }]], // method differs
	['taller tyre, warm day', { rearTyre: '130/70-12' }, [108, { method: 'radar', temp: 25 }]], // counts: tyre +2 (air ~4 % thinner)
	['tyre back, hot day', { rearTyre: '120/70-12' }, [106.5, { method: 'radar', temp: 40 }]], // air > 5 % thinner
	[
		'ignition only',
		{ ignitionType: 'digital, advance curve B' },
		[107, { method: 'radar', temp: 40 }]
	], // another field: mixed
	['nothing but the peak rpm seen', { peakRpm: 10400 }, [107.2, { method: 'radar', temp: 40 }]], // no change
	['variator, not yet measured', { variatorType: 'sport' }, null] // no run
];
let buildId = 0;

beforeAll(async () => {
	const owner = await makeUser();
	const b = await builds.create(owner.id, {
		title: 'Change-effects fixture',
		engineCycle: 'four-stroke',
		chassis: 'fixture',
		engineFamily: 'fixture',
		brakeFront: 'disc',
		brakeRear: 'drum'
	});
	buildId = b.id;
	let config: Record<string, unknown> = { ...BASE };
	for (const [note, change, measured] of STEPS) {
		config = { ...config, ...change };
		const { id } = (await saveSetup(b.id, { ...config, changeNote: note } as never)) as {
			id: number;
		};
		if (measured) await saveRun(b.id, id, run(measured[0], measured[1]) as never);
	}
	await setPublication((await builds.read(b.id))!, 'published');
});
afterAll(closeDb);

describe('change effects', () => {
	it('judges each step of the fixture by the rules', async () => {
		const steps = await stepsOf(buildId);
		expect(steps.map((s) => [s.kind, s.counts, s.counts ? s.deltaKmh : s.why])).toEqual([
			['final-drive', true, 4],
			['mixed', false, 'more than one kind of change at once'],
			['rollers', false, 'measured by different methods'],
			['tyre', true, 2],
			['tyre', false, 'air density differs by more than 5 %'],
			['mixed', false, 'more than one kind of change at once'],
			['none', false, 'nothing changed'],
			['variator', false, 'one of the two setups has no run']
		]);
	});

	it('stores the same verdicts, so the aggregate lists exactly the pairs that count', async () => {
		const stored = await models().Setup.findAll({
			where: { buildId },
			order: [['position', 'ASC']]
		});
		expect(stored.map((s) => s.effectKmh)).toEqual([
			null,
			4,
			null,
			null,
			2,
			null,
			null,
			null,
			null
		]);
		expect(stored[1].prevSetupId).toBe(stored[0].id);
		const mine = async (kind: 'final-drive' | 'tyre' | 'rollers') =>
			(await pairsFor(kind, 1000)).filter((p) => p.buildId === buildId);
		expect((await mine('final-drive')).map((p) => [p.position, p.deltaKmh])).toEqual([[2, 4]]);
		expect((await mine('tyre')).map((p) => [p.position, p.deltaKmh])).toEqual([[5, 2]]);
		expect(await mine('rollers')).toEqual([]);
	});

	it('a step is judged again when the setup before it changes', async () => {
		const [first, second] = await models().Setup.findAll({
			where: { buildId },
			order: [['position', 'ASC']],
			limit: 2
		});
		// Make the baseline's run radar: the final-drive step no longer compares like with like.
		const r = await models().Run.findOne({ where: { setupId: first.id } });
		await saveRun(buildId, first.id, { ...run(100), method: 'radar' } as never, {
			id: r!.id,
			version: r!.version
		});
		await second.reload();
		expect(second.effectKmh).toBeNull();
		await saveRun(buildId, first.id, run(100) as never, { id: r!.id, version: r!.version + 1 });
		await second.reload();
		expect(second.effectKmh).toBe(4);
	});

	it('median and quartiles from SQL equal a reference computation (d3-array, R-7 quantiles)', async () => {
		const rows = await db().query<{ kind: string; e: number }>(
			'SELECT change_kind AS kind, effect_kmh AS e FROM setups WHERE any_listed = 1 AND effect_kmh IS NOT NULL',
			{ type: QueryTypes.SELECT }
		);
		const summary = await summarise();
		expect(summary.some((k) => k.pairs > 0)).toBe(true);
		for (const k of summary) {
			const xs = rows.filter((r) => r.kind === k.kind).map((r) => Number(r.e));
			expect(k.pairs).toBe(xs.length);
			if (!xs.length) continue;
			// MariaDB's PERCENTILE_CONT and d3-array's quantile both interpolate linearly.
			expect(k.medianKmh).toBeCloseTo(quantile(xs, 0.5)!, 9);
			expect(k.q1Kmh).toBeCloseTo(quantile(xs, 0.25)!, 9);
			expect(k.q3Kmh).toBeCloseTo(quantile(xs, 0.75)!, 9);
		}
	});

	it('the newest steps walk the setups newest first and stop: no build is sorted', async () => {
		const spy = vi.spyOn(db(), 'query');
		const steps = await newestSteps(6);
		const sql = String(spy.mock.calls[0][0]);
		spy.mockRestore();
		expect(steps.length).toBeGreaterThan(0);
		const plan = await db().query<{ table: string; key: string | null; Extra: string | null }>(
			`EXPLAIN ${sql.replace(':limit', '6')}`,
			{ type: QueryTypes.SELECT }
		);
		// Before: MariaDB read every build and sorted them (500 ms a home page at 100,000 builds).
		expect(plan[0]).toMatchObject({ table: 's', key: 'PRIMARY' });
		for (const p of plan) expect(p.Extra ?? '').not.toMatch(/filesort|temporary/);
	});

	it('makes the same number of queries whatever the number of pairs listed', async () => {
		const spy = vi.spyOn(db(), 'query');
		await pairsFor('tyre', 1);
		const one = spy.mock.calls.length;
		spy.mockClear();
		await pairsFor('tyre', 200);
		expect(spy.mock.calls.length).toBe(one);
		spy.mockClear();
		await summarise();
		expect(spy.mock.calls.length).toBe(2);
		spy.mockRestore();
	});
});
