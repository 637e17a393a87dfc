import { linearRegression, sampleCorrelation } from 'simple-statistics';
import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { buildListSchema } from '../../src/lib/schemas/build-list';
import { LIST_TUNING, listBuilds } from '../../src/lib/server/search/build-list';
import { closeDb, db } from '../../src/lib/server/db/connection';
import { forgetVocabulary } from '../../src/lib/server/search/vocabulary';
import { MAX_POINTS, speedMap, xSpread } from '../../src/lib/server/stats/speed-map';
import { engineFamilies } from '../../src/lib/server/stats/families';
import { speedMapQuerySchema } from '../../src/lib/schemas/stats';
import * as builds from '../../src/lib/server/sheet/builds';
import { destroyBuild, saveBuild, setPublication } from '../../src/lib/server/sheet/build-service';
import { makeUser } from '../support/factories';
import { publishedBuild } from '../support/moderation-fixtures';

// Against the seeded demo sheets (invented, fixed seed) plus whatever earlier test files added.
afterAll(closeDb);
const map = (q: Record<string, unknown>) => speedMap(speedMapQuerySchema.parse(q));
const list = (q: Record<string, unknown>) => listBuilds(buildListSchema.parse(q), 'metric');

describe('speed map', () => {
	it('returns each published build’s latest measured setup that passes the filters', async () => {
		const all = await map({ x: 'displacement' });
		const gpsChambers = await map({
			x: 'displacement',
			method: 'gps-logger',
			pipe: 'expansion-chamber'
		});
		const [{ n }] = await db().query<{ n: number }>(
			`SELECT COUNT(*) AS n FROM setups s JOIN builds b ON b.id = s.build_id
			WHERE b.publication = 'published' AND b.moderation = 'visible'
				AND s.position = (SELECT MAX(s2.position) FROM setups s2 WHERE s2.build_id = b.id AND s2.best_run_kmh IS NOT NULL)
				AND s.displacement_cc IS NOT NULL AND s.best_run_method = 'gps-logger' AND s.exhaust_type = 'expansion-chamber'`,
			{ type: QueryTypes.SELECT }
		);
		expect(gpsChambers.total).toBe(Number(n));
		expect(gpsChambers.total).toBeGreaterThan(0);
		expect(gpsChambers.total).toBeLessThan(all.total);
		expect(gpsChambers.points.every((p) => p.pipe === 'expansion-chamber')).toBe(true);
	});

	it('draws its trend line by least squares (checked against simple-statistics)', async () => {
		const m = await map({ x: 'final-drive' });
		expect(m.mode).toBe('points');
		const pairs = m.points.map((p) => [Number(p.x), p.kmh]);
		const ref = linearRegression(pairs);
		expect(m.trend!.slope).toBeCloseTo(ref.m, 6);
		expect(m.trend!.intercept).toBeCloseTo(ref.b, 6);
		expect(m.trend!.r).toBeCloseTo(
			sampleCorrelation(
				pairs.map((p) => p[0]),
				pairs.map((p) => p[1])
			),
			6
		);
		// A category across has no trend line.
		expect((await map({ x: 'exhaust' })).trend).toBeNull();
	});

	it('draws no trend line across clusters, and says why', async () => {
		// The demo displacements are 50 cc stock and 68–70 cc kits: two clusters, one line between
		// their averages. The page says so instead of drawing it.
		const m = await map({ x: 'displacement' });
		expect(m.total).toBeGreaterThan(20);
		expect(m.trend).toBeNull();
		expect(m.trendHidden).toMatch(/too few different values|separate clusters/);
		expect(xSpread([5, 6, 20, 21])).toMatch(/separate clusters/);
		expect(xSpread([1, 2])).toMatch(/too few/);
		expect(xSpread([1, 2, 3, 5, 6])).toBeNull();
	});

	it('sends bins instead of points beyond the limit, with the same total and trend', async () => {
		const q = speedMapQuerySchema.parse({ x: 'final-drive' });
		const points = await speedMap(q);
		const bins = await speedMap(q, 10);
		expect(points.mode).toBe('points');
		expect(bins.mode).toBe('bins');
		expect(bins.total).toBe(points.total);
		expect(bins.bins.reduce((a, b) => a + b.n, 0)).toBe(points.total);
		for (const b of bins.bins) {
			const inside = points.points.filter(
				(p) =>
					p.pipe === b.pipe &&
					(p.x as number) >= (b.x as number) &&
					(p.x as number) < b.x2! &&
					p.kmh >= b.y &&
					p.kmh < b.y2
			);
			expect(inside.length).toBe(b.n);
		}
		expect(bins.trend!.slope).toBeCloseTo(points.trend!.slope, 9);
		expect(bins.trend!.intercept).toBeCloseTo(points.trend!.intercept, 9);
	});

	it('makes at most two queries, whether it sends a handful of points, all of them or bins', async () => {
		const spy = vi.spyOn(db(), 'query');
		const counts: number[] = [];
		try {
			for (const [q, max] of [
				[{ x: 'jet', method: 'gps-logger', twoWay: '1' }, undefined],
				[{ x: 'jet' }, undefined],
				[{ x: 'jet' }, 5]
			] as const) {
				spy.mockClear();
				const m = await speedMap(speedMapQuerySchema.parse(q), max);
				expect(m.total).toBeGreaterThan(5);
				counts.push(spy.mock.calls.length);
			}
		} finally {
			spy.mockRestore();
		}
		// Bins and sums, then the points when few enough: never one query per build.
		expect(counts).toEqual([2, 2, 1]);
		expect(MAX_POINTS).toBeGreaterThan(100);
	});
});

describe('engine families for the filter lists', () => {
	it('start one read when many page views find the list out of date at once', async () => {
		const later = Date.now() + 3_600_000;
		const spy = vi.spyOn(db(), 'query');
		try {
			const lists = await Promise.all([1, 2, 3, 4].map(() => engineFamilies(later)));
			expect(spy).toHaveBeenCalledTimes(1);
			expect(new Set(lists.map((l) => l.join('|'))).size).toBe(1);
			expect(lists[0].length).toBeGreaterThan(0);
		} finally {
			spy.mockRestore();
		}
	});
});

describe('builds list and search', () => {
	it('applies three filters together, in the reader’s units', async () => {
		const page = await list({ exhaust: 'expansion-chamber', ccMin: 60, speedMin: 80, limit: 100 });
		expect(page.builds.length).toBeGreaterThan(0);
		for (const b of page.builds) {
			expect(b.exhaust).toBe('expansion-chamber');
			expect(b.displacementCc!).toBeGreaterThanOrEqual(60);
			expect(b.bestSpeedKmh!).toBeGreaterThanOrEqual(80);
		}
		// 50 mph is 80.47 km/h (1 mi = 1.609344 km exactly, NIST SP 811).
		const mph = await listBuilds(buildListSchema.parse({ speedMin: 50, limit: 100 }), 'imperial');
		expect(mph.builds.every((b) => b.bestSpeedKmh! >= 80.4672)).toBe(true);
	});

	it('finds the same pages whether it walks the order or ranges over the filters', async () => {
		const asks = [
			{ exhaust: 'expansion-chamber', ccMin: 60, sort: 'fastest' },
			{ exhaust: 'stock', ccMax: 55, speedMin: 40, sort: 'newest' },
			{ elevMin: 300, elevMax: 1500, sort: 'cheapest' },
			{ ccMin: 45, ccMax: 75, cycle: 'two-stroke', sort: 'fastest' },
			{ ccMin: 49.5, ccMax: 68.5, speedMin: 60, sort: 'newest' },
			{ exhaust: 'expansion-chamber', ccMin: 65, ccMax: 75, speedMin: 60, sort: 'fastest' }
		];
		const saved = LIST_TUNING.walkCap;
		try {
			for (const a of asks) {
				LIST_TUNING.walkCap = 0; // always range over the filters
				const ranged = await list({ ...a, limit: 7 });
				const next1 = await list({ ...a, limit: 7, cursor: ranged.next });
				LIST_TUNING.walkCap = 1_000_000; // always walk the order's index
				const walked = await list({ ...a, limit: 7 });
				const next2 = await list({ ...a, limit: 7, cursor: walked.next });
				expect(
					walked.builds.map((b) => b.id),
					JSON.stringify(a)
				).toEqual(ranged.builds.map((b) => b.id));
				expect(
					next2.builds.map((b) => b.id),
					JSON.stringify(a)
				).toEqual(next1.builds.map((b) => b.id));
				expect(walked.builds.length).toBeGreaterThan(0);
			}
		} finally {
			LIST_TUNING.walkCap = saved;
		}
	});

	it('walks at most walkCap entries of the order, then ranges over the filters', async () => {
		const saved = LIST_TUNING.walkCap;
		const spy = vi.spyOn(db(), 'query');
		try {
			LIST_TUNING.walkCap = 3;
			// Few builds in the first three of the order pass a narrow band: the range finds them.
			const q = { ccMin: 49, ccMax: 50, speedMin: 40, sort: 'fastest', limit: 5 } as const;
			spy.mockClear();
			const page = await list(q);
			const sqls = spy.mock.calls.map((c) => String(c[0]));
			expect(sqls.length).toBe(3); // the walk, the range, the rows' details
			expect(sqls[0]).toContain('ROWS EXAMINED :walkCap');
			expect(sqls[1]).toContain('builds_by_whole_cc');
			// Each whole-cc step is read in its index's own order (speed, then id): no step is sorted.
			const steps = await db().query<{ table: string; Extra: string | null }>(
				`EXPLAIN ${sqls[1]}`,
				{
					replacements: (spy.mock.calls[1][1] as { replacements: Record<string, unknown> })
						.replacements,
					type: QueryTypes.SELECT
				}
			);
			const reads = steps.filter((p) => p.table === 'b');
			expect(reads.length).toBeGreaterThan(0);
			for (const p of reads) expect(p.Extra ?? '').not.toContain('filesort');
			for (const b of page.builds) {
				expect(b.displacementCc!).toBeGreaterThanOrEqual(49);
				expect(b.displacementCc!).toBeLessThanOrEqual(50);
				expect(b.bestSpeedKmh!).toBeGreaterThanOrEqual(40);
			}
			// The range reads those whole cc steps and speeds only (MariaDB's own count of rows read).
			const [plan] = await db().query<{ ANALYZE: string }>(`ANALYZE FORMAT=JSON ${sqls[1]}`, {
				replacements: (spy.mock.calls[1][1] as { replacements: Record<string, unknown> })
					.replacements,
				type: QueryTypes.SELECT
			});
			const read = JSON.stringify(JSON.parse(Object.values(plan)[0] as string));
			const [{ n }] = await db().query<{ n: number }>(
				`SELECT COUNT(*) AS n FROM builds WHERE publication = 'published' AND moderation = 'visible'
					AND rep_cc >= 49 AND rep_cc < 51 AND best_speed_kmh >= 40`,
				{ type: QueryTypes.SELECT }
			);
			// Every access to builds, summed (fastest first reads each whole cc step apart).
			const rows = [...read.matchAll(/"r_rows":\s*([\d.]+)/g)].reduce(
				(a, m) => a + Number(m[1]),
				0
			);
			expect(rows).toBeGreaterThan(0);
			expect(rows).toBeLessThanOrEqual(2 * Number(n) + 2 * 6);
		} finally {
			LIST_TUNING.walkCap = saved;
			spy.mockRestore();
		}
	});

	it('orders by cost within one currency and leaves builds with no parts out', async () => {
		for (const currency of ['EUR', 'GBP']) {
			const one = await list({ sort: 'cheapest', currency, limit: 10 });
			const two = await list({ sort: 'cheapest', currency, limit: 10, cursor: one.next });
			const rows = [...one.builds, ...two.builds];
			expect(rows.length).toBeGreaterThan(3);
			expect(rows.every((b) => b.currency === currency)).toBe(true);
			expect(rows.every((b) => b.partsTotalMinor > 0)).toBe(true);
			const costs = rows.map((b) => b.partsTotalMinor);
			expect(costs).toEqual([...costs].sort((a, b) => a - b));
			expect(new Set(rows.map((b) => b.id)).size).toBe(rows.length);
		}
		// No currency named: euros (the pages pass the reader's own; see currencyFor).
		const plain = await list({ sort: 'cheapest', limit: 20 });
		expect(plain.builds.every((b) => b.currency === 'EUR')).toBe(true);
	});

	it('pages by key without overlap, fastest first', async () => {
		const one = await list({ sort: 'fastest', limit: 5 });
		const two = await list({ sort: 'fastest', limit: 5, cursor: one.next });
		const ids = [...one.builds, ...two.builds].map((b) => b.id);
		expect(new Set(ids).size).toBe(10);
		const speeds = [...one.builds, ...two.builds].map((b) => b.bestSpeedKmh ?? -1);
		expect(speeds).toEqual([...speeds].sort((a, b) => b - a));
	});

	it('finds words in part names and titles, and a misspelt part name through the nearest term', async () => {
		forgetVocabulary();
		const exact = await list({ q: 'Halvard', limit: 100 });
		expect(exact.builds.length).toBeGreaterThan(0);
		expect(exact.didYouMean).toBeNull();
		const typo = await list({ q: 'Halvrad', limit: 100 });
		expect(typo.didYouMean).toBe('halvard');
		expect(typo.builds.map((b) => b.id)).toEqual(exact.builds.map((b) => b.id));
		const nothing = await list({ q: 'zzqxv', limit: 10 });
		expect(nothing.builds).toEqual([]);
	});

	it('finds, page by page, the builds MariaDB’s own FULLTEXT search finds, in either order', async () => {
		// The reference: InnoDB's FULLTEXT index over the same columns, each word required and taken
		// as a prefix (MariaDB Knowledge Base, "MATCH AGAINST", boolean mode "+word*").
		for (const typed of ['kit', 'cham', 'tuned kit', 'closed course gps', 'dunmore sport']) {
			const rows = await db().query<{ id: number }>(
				`SELECT id FROM builds WHERE publication = 'published' AND moderation = 'visible'
				AND MATCH(title, story, parts_text) AGAINST (:q IN BOOLEAN MODE) ORDER BY id DESC`,
				{
					replacements: {
						q: typed
							.split(' ')
							.map((w) => `+${w}*`)
							.join(' ')
					},
					type: QueryTypes.SELECT
				}
			);
			const want = rows.map((r) => Number(r.id));
			expect(want.length, typed).toBeGreaterThan(0);
			for (const sort of ['newest', 'fastest'] as const) {
				const got: number[] = [];
				let cursor: string | undefined;
				do {
					const p = await list({ q: typed, sort, limit: 7, cursor });
					got.push(...p.builds.map((b) => b.id));
					cursor = p.next ?? undefined;
				} while (cursor);
				if (sort === 'newest') expect(got, typed).toEqual(want);
				else
					expect(
						[...got].sort((a, b) => b - a),
						typed
					).toEqual(want);
			}
		}
	});

	it('keeps the word index with the sheet: a new title is found, an unpublished build is not', async () => {
		const owner = await makeUser();
		const { build } = await publishedBuild(owner.id, 'Quillwort special');
		const ids = async (q: string) => (await list({ q })).builds.map((b) => b.id);
		expect(await ids('quillwort')).toEqual([build.id]);
		await saveBuild(build.id, build.version, { title: 'Brackenfield special' });
		expect(await ids('quillwort')).toEqual([]);
		expect(await ids('brackenf')).toEqual([build.id]);
		await setPublication((await builds.read(build.id))!, 'draft');
		expect(await ids('brackenfield')).toEqual([]);
	});

	it('keeps the vocabulary with the word index: new words join, words no build holds leave', async () => {
		const inVocabulary = async (w: string) =>
			(
				await db().query<{ n: number }>(
					'SELECT COUNT(*) AS n FROM search_vocabulary WHERE word = :w',
					{ replacements: { w }, type: QueryTypes.SELECT }
				)
			)[0].n > 0;
		const owner = await makeUser();
		const one = await publishedBuild(owner.id, 'Zerrowmint special');
		const two = await publishedBuild(owner.id, 'Zerrowmint trial');
		expect(await inVocabulary('zerrowmint')).toBe(true);
		expect(await inVocabulary('trial')).toBe(true);
		await saveBuild(two.build.id, two.build.version, { title: 'Quorrelby trial' });
		// One build still holds it.
		expect(await inVocabulary('zerrowmint')).toBe(true);
		expect(await inVocabulary('quorrelby')).toBe(true);
		await destroyBuild(one.build.id);
		expect(await inVocabulary('zerrowmint')).toBe(false);
		await setPublication((await builds.read(two.build.id))!, 'draft');
		expect(await inVocabulary('quorrelby')).toBe(false);
		// The typo correction reads it: a gone word is no longer offered.
		forgetVocabulary();
		expect((await list({ q: 'zerrowmitn' })).didYouMean).not.toBe('zerrowmint');
		await destroyBuild(two.build.id);
	});

	it('walks the word index newest first and stops after a page: no sort of every match', async () => {
		const spy = vi.spyOn(db(), 'query');
		try {
			await list({ q: 'kit', limit: 5 });
			const [sql, options] = spy.mock.calls[1] as unknown as [
				string,
				{ replacements: Record<string, unknown> }
			];
			spy.mockRestore();
			const plan = await db().query<{ table: string; key: string; Extra: string | null }>(
				`EXPLAIN ${sql}`,
				{ replacements: options.replacements, type: QueryTypes.SELECT }
			);
			const walk = plan.find((p) => p.table === 't')!;
			expect(walk.key).toBe('PRIMARY');
			expect(walk.Extra ?? '').not.toContain('filesort');
			// With no filter but the words, no build is read until the page's own details.
			expect(plan.map((p) => p.table)).not.toContain('b');
		} finally {
			spy.mockRestore();
		}
	});

	it('walks a filtered page in the order’s index alone, in index order, so a stopped walk is a true prefix', async () => {
		const spy = vi.spyOn(db(), 'query');
		try {
			for (const [sort, key] of [
				['newest', 'builds_walk_newest'],
				['fastest', 'builds_walk_fastest']
			] as const) {
				spy.mockClear();
				await list({
					exhaust: 'stock',
					ccMax: 55,
					speedMin: 30,
					cycle: 'two-stroke',
					sort,
					limit: 5
				});
				const [sql, options] = spy.mock.calls[0] as unknown as [
					string,
					{ replacements: Record<string, unknown> }
				];
				expect(sql).toContain('ROWS EXAMINED');
				const plan = await db().query<{ table: string; key: string; Extra: string | null }>(
					`EXPLAIN ${sql}`,
					{ replacements: options.replacements, type: QueryTypes.SELECT }
				);
				expect(plan).toHaveLength(1);
				expect(plan[0].key, sort).toBe(key);
				expect(plan[0].Extra ?? '', sort).toContain('Using index');
				expect(plan[0].Extra ?? '', sort).not.toContain('filesort');
			}
		} finally {
			spy.mockRestore();
		}
	});

	it('makes at most three queries for a page of 5 or of 100, never one a row', async () => {
		const spy = vi.spyOn(db(), 'query');
		try {
			const counts: number[] = [];
			for (const limit of [5, 100]) {
				spy.mockClear();
				const page = await list({ exhaust: 'stock', ccMax: 55, limit });
				expect(page.builds.length).toBeGreaterThan(limit === 5 ? 4 : 5);
				counts.push(spy.mock.calls.length);
			}
			// The walk of the order (and, when it held too few, the range over the filters), then
			// the rows' details.
			expect(counts[0]).toBe(2);
			expect(counts[1]).toBeLessThanOrEqual(3);
		} finally {
			spy.mockRestore();
		}
	});
});
