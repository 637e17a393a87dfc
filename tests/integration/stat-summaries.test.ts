import { quantile } from 'd3-array';
import { linearRegression } from 'simple-statistics';
import mariadb from 'mariadb';
import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { CHANGE_KINDS } from '../../src/lib/sheet/change-kinds';
import { speedMapQuerySchema } from '../../src/lib/schemas/stats';
import { SPEED_MAP_X, type SpeedMapX } from '../../src/lib/stats/speed-map-axes';
import { fillStatements } from '../../src/lib/stats/summary-sql';
import { closeDb, db } from '../../src/lib/server/db/connection';
import * as builds from '../../src/lib/server/sheet/builds';
import { destroyBuild, setPublication } from '../../src/lib/server/sheet/build-service';
import { removeSetup, saveRun, saveSetup } from '../../src/lib/server/sheet/service';
import { speedMap, speedMapKept } from '../../src/lib/server/stats/speed-map';
import { changeEffectsKept, summarise } from '../../src/lib/server/stats/change-effects';
import { snapshot } from '../support/all-or-nothing';
import { makeUser } from '../support/factories';
import { FIXTURE_SETUP, fixtureRun } from '../support/sheet-fixtures';

// The speed map's bins and change effects' counts are kept on every write (taking away what a
// build added before, adding what it holds now). These checks compare them with the same figures
// computed straight from the setups, and with a fill from scratch, after a run of edits.
afterAll(closeDb);

type Row = Record<string, unknown>;
const TABLES = ['stat_marks', 'speed_map_bins', 'effect_counts'];

const READ_BINS =
	'SELECT axis, method, cycle, family, two_way, venue, xb, yb, pipe, n, sx, sy, sxx, sxy, syy FROM speed_map_bins WHERE n <> 0 ORDER BY 1, 2, 3, 4, 5, 6, 7, 8, 9';
const READ_COUNTS = 'SELECT kind, grain, v, n FROM effect_counts WHERE n <> 0 ORDER BY 1, 2, 3';

/**
 * The summaries' rows as kept, and as a fill from scratch writes them: on one connection of the
 * owner account (the app's may not make temporary tables), whose temporary tables hide the real
 * ones of the same name for that connection only.
 */
async function keptAndFresh() {
	const e = process.env;
	const c = await mariadb.createConnection({
		host: e.DB_HOST,
		port: Number(e.DB_PORT),
		user: e.DB_OWNER_USER,
		password: e.DB_OWNER_PASSWORD,
		database: e.DB_NAME
	});
	try {
		const read = async () => ({
			bins: (await c.query(READ_BINS)) as Row[],
			counts: (await c.query(READ_COUNTS)) as Row[]
		});
		const kept = await read();
		for (const t of TABLES) {
			const [shown] = (await c.query(`SHOW CREATE TABLE ${t}`)) as Row[];
			await c.query(
				String(shown['Create Table']).replace(/^CREATE TABLE/, 'CREATE TEMPORARY TABLE')
			);
		}
		for (const sql of fillStatements()) await c.query(sql);
		const fresh = await read();
		return { kept, fresh };
	} finally {
		await c.end();
	}
}

const rounded = (rows: Row[]) =>
	rows.map((r) =>
		Object.fromEntries(
			Object.entries(r).map(([k, v]) => [k, typeof v === 'number' ? Number(v.toPrecision(9)) : v])
		)
	);

async function sheet(owner: string, title: string, steps: [Record<string, unknown>, number][]) {
	const b = await builds.create(owner, {
		title,
		engineCycle: 'four-stroke',
		chassis: 'summary fixture',
		engineFamily: 'summary family',
		story: 'A fixture for the kept summaries.'
	});
	let config: Record<string, unknown> = { ...FIXTURE_SETUP };
	const setups: number[] = [];
	for (const [change, speed] of steps) {
		config = { ...config, ...change };
		const { id } = await saveSetup(b.id, config as never);
		await saveRun(b.id, id, fixtureRun(speed) as never);
		setups.push(id);
	}
	await setPublication((await builds.read(b.id))!, 'published');
	return { id: b.id, setups };
}

describe('kept summaries', () => {
	it('equal a fill from scratch after publishing, editing, hiding and deleting', async () => {
		const owner = await makeUser();
		const a = await sheet(owner.id, 'Summary A', [
			[{}, 80],
			[{ primaryDriver: 16 }, 83.4],
			[{ mainJet: 96 }, 82.15]
		]);
		const b = await sheet(owner.id, 'Summary B', [
			[{ bore: 50 }, 91],
			[{ rollerWeights: '6x4.5' }, 92.5]
		]);
		// A run edited: the build's mark moves to another speed bin.
		const [run] = await db().query<{ id: number; version: number }>(
			'SELECT id, version FROM runs WHERE setup_id = :s',
			{ replacements: { s: a.setups[2] }, type: QueryTypes.SELECT }
		);
		await saveRun(a.id, a.setups[2], fixtureRun(99.9) as never, run);
		// A setup removed from the middle: the next one's step changes kind.
		await removeSetup(b.id, b.setups[0]);
		// Back to draft and published again; then one build deleted outright.
		await setPublication((await builds.read(a.id))!, 'draft');
		let { kept, fresh } = await keptAndFresh();
		expect(rounded(kept.bins)).toEqual(rounded(fresh.bins));
		expect(kept.counts).toEqual(fresh.counts);
		await setPublication((await builds.read(a.id))!, 'published');
		await destroyBuild(b.id);
		({ kept, fresh } = await keptAndFresh());
		expect(rounded(kept.bins)).toEqual(rounded(fresh.bins));
		expect(kept.counts).toEqual(fresh.counts);
		expect(kept.bins.length).toBeGreaterThan(100);
	});

	it('give the speed map the figures counted straight from the setups, for every axis and filters', async () => {
		// The reference: the listed setups read plainly, binned and summed here.
		const marks = await db().query<Row>(
			`SELECT best_run_method AS method, engine_cycle AS cycle, engine_family AS family,
				best_run_two_way AS two_way, best_run_venue AS venue, close_pipe AS pipe, best_run_kmh AS kmh,
				displacement_cc, final_drive_ratio, overall_ratio, sea_level_jet, roller_total_g, best_run_elevation_m
			FROM setups WHERE listed = 1`,
			{ type: QueryTypes.SELECT }
		);
		const queries: Record<string, unknown>[] = [
			{},
			{ method: 'gps-logger' },
			{ method: ['gps-logger', 'radar'], pipe: 'expansion-chamber' },
			{ twoWay: '1', closed: '1' },
			{ cycle: 'two-stroke', family: String(marks[0].family) },
			{ cycle: 'four-stroke', twoWay: '1' }
		];
		let compared = 0;
		for (const x of Object.keys(SPEED_MAP_X) as SpeedMapX[])
			for (const extra of queries) {
				const q = speedMapQuerySchema.parse({ x, ...extra });
				const col = SPEED_MAP_X[x].col.replace('s.', '');
				const chosen = marks.filter(
					(m) =>
						(!q.method.length || q.method.includes(String(m.method) as never)) &&
						(!q.pipe.length || q.pipe.includes(String(m.pipe))) &&
						(!q.twoWay || Number(m.two_way) === 1) &&
						(!q.closed || m.venue === 'closed-course') &&
						(!q.cycle || m.cycle === q.cycle) &&
						(!q.family || m.family === q.family) &&
						m[col] !== null &&
						(x !== 'exhaust' || m.pipe !== '')
				);
				const binned = await speedMap(q, 0);
				expect(binned.total, `${x} ${JSON.stringify(extra)}`).toBe(chosen.length);
				expect(binned.bins.reduce((t, b) => t + b.n, 0)).toBe(chosen.length);
				for (const bin of binned.bins) {
					const inside = chosen.filter(
						(m) =>
							m.pipe === bin.pipe &&
							Number(m.kmh) >= bin.y &&
							Number(m.kmh) < bin.y2 &&
							(x === 'exhaust' || (Number(m[col]) >= (bin.x as number) && Number(m[col]) < bin.x2!))
					);
					expect(inside.length).toBe(bin.n);
				}
				if (binned.trend) {
					// Least squares checked against simple-statistics over the same marks.
					const ref = linearRegression(chosen.map((m) => [Number(m[col]), Number(m.kmh)]));
					expect(binned.trend.slope).toBeCloseTo(ref.m, 6);
					expect(binned.trend.intercept).toBeCloseTo(ref.b, 6);
					compared++;
				}
			}
		expect(compared).toBeGreaterThan(3);
	});

	it('give change effects the quartiles d3-array computes over the stored pairs', async () => {
		const pairs = await db().query<{ kind: string; effect_kmh: number | null }>(
			'SELECT change_kind AS kind, effect_kmh FROM setups WHERE any_listed = 1 AND change_kind IS NOT NULL',
			{ type: QueryTypes.SELECT }
		);
		const got = await summarise();
		let checked = 0;
		for (const { kind } of CHANGE_KINDS) {
			const values = pairs
				.filter((p) => p.kind === kind && p.effect_kmh !== null)
				.map((p) => Number(p.effect_kmh));
			const row = got.find((g) => g.kind === kind)!;
			expect(row.pairs).toBe(values.length);
			expect(row.excluded).toBe(
				pairs.filter((p) => p.kind === kind && p.effect_kmh === null).length
			);
			if (!values.length) continue;
			// d3's quantile is R-7, the definition the page states.
			expect(row.q1Kmh).toBeCloseTo(quantile(values, 0.25)!, 9);
			expect(row.medianKmh).toBeCloseTo(quantile(values, 0.5)!, 9);
			expect(row.q3Kmh).toBeCloseTo(quantile(values, 0.75)!, 9);
			checked++;
		}
		expect(checked).toBeGreaterThan(3);
	});

	it('read a few rows whatever the number of builds: two statements on the summary tables', async () => {
		const spy = vi.spyOn(db(), 'query');
		try {
			await summarise();
			await speedMap(speedMapQuerySchema.parse({ x: 'jet', method: 'radar' }), 0);
			const sql = spy.mock.calls.map((c) => String(c[0]));
			expect(sql).toHaveLength(3);
			expect(sql.every((s) => /FROM (effect_counts|speed_map_bins)/.test(s))).toBe(true);
			expect(sql.some((s) => /FROM setups/.test(s))).toBe(false);
		} finally {
			spy.mockRestore();
		}
	});

	it('are kept in the change’s transaction: a failure between the two summaries leaves nothing written', async () => {
		const owner = await makeUser();
		const a = await sheet(owner.id, 'Summary C', [
			[{}, 77],
			[{ needleClip: 3 }, 78.2]
		]);
		const before = await snapshot();
		const s = db();
		const real = s.query.bind(s);
		const spy = vi.spyOn(s, 'query').mockImplementation(((sql: unknown, ...rest: unknown[]) => {
			if (typeof sql === 'string' && sql.trimStart().startsWith('INSERT INTO effect_counts'))
				return Promise.reject(new Error('injected failure after the speed bins'));
			return (real as (...a: unknown[]) => Promise<unknown>)(sql, ...rest);
		}) as never);
		try {
			await expect(saveRun(a.id, a.setups[1], fixtureRun(85) as never)).rejects.toThrow(
				'injected failure after the speed bins'
			);
		} finally {
			spy.mockRestore();
		}
		const after = await snapshot();
		delete before.mail_queue;
		delete after.mail_queue;
		expect(after).toEqual(before);
	});

	it('kept per process, are read again as soon as a sheet changes, and cost one lookup while none does', async () => {
		const owner = await makeUser();
		const family = `kept fixture ${Date.now()}`;
		const q = speedMapQuerySchema.parse({ x: 'jet', cycle: 'four-stroke', family });
		const c = await sheet(owner.id, 'Summary D', [[{}, 81]]);
		await db().query('UPDATE builds SET engine_family = :family WHERE id = :id', {
			replacements: { id: c.id, family }
		});
		await setPublication((await builds.read(c.id))!, 'draft');
		await setPublication((await builds.read(c.id))!, 'published');
		const first = await speedMapKept(q);
		expect(first.total).toBe(1);
		const effects = await changeEffectsKept('needle-clip');
		// Nothing changed: one primary-key lookup each, the same answers.
		const spy = vi.spyOn(db(), 'query');
		try {
			expect(await speedMapKept(q)).toBe(first);
			expect(await changeEffectsKept('needle-clip')).toBe(effects);
			expect(spy.mock.calls.map((c) => String(c[0]))).toEqual([
				'SELECT v FROM summary_version WHERE id = 1',
				'SELECT v FROM summary_version WHERE id = 1'
			]);
		} finally {
			spy.mockRestore();
		}
		// A new run, a new best: the next read has it, with no wait.
		const { id } = await saveSetup(c.id, { ...FIXTURE_SETUP, needleClip: 3 } as never);
		await saveRun(c.id, id, fixtureRun(84.5) as never);
		const after = await speedMapKept(q);
		expect(after.points.map((p) => p.kmh)).toEqual([84.5]);
		const moved = await changeEffectsKept('needle-clip');
		expect(moved.kinds.find((k) => k.kind === 'needle-clip')!.pairs).toBe(
			effects.kinds.find((k) => k.kind === 'needle-clip')!.pairs + 1
		);
	});
});
