import { afterAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/lib/server/db/connection';
import * as builds from '../../src/lib/server/sheet/builds';
import * as runs from '../../src/lib/server/sheet/runs';
import * as setups from '../../src/lib/server/sheet/setups';
import type { SetupConfig } from '../../src/lib/server/db/models/setup';
import { exportBuild } from '../../src/lib/server/sheet/export';
import { saveRun, saveSetup } from '../../src/lib/server/sheet/service';
import { makeUser } from '../support/factories';

afterAll(closeDb);

// Binary floating point: 0.8 + 0.05 is 0.8500000000000001 and 0.47 * 2 is 0.94 only by luck;
// values computed like this (demo data, scripts, unit conversions) must be kept as a person wrote them.
const squish = 0.8 + 0.05;
const cvt = 0.9 + 0.04; // 0.9400000000000001

describe('numbers are kept at their field precision', () => {
	it('a setup and a run saved with float noise are stored and exported clean', async () => {
		expect(String(squish)).toBe('0.8500000000000001');
		expect(String(cvt)).toBe('0.9400000000000001');
		const u = await makeUser();
		const b = await builds.create(u.id, { title: 'Float noise' });
		const { id } = (await saveSetup(b.id, {
			changeNote: 'Stock baseline',
			isStock: true,
			bore: 40,
			stroke: 39.2,
			squish,
			topCvtRatio: cvt
		})) as { id: number };
		const stored = (await setups.read(b.id, id))!.config as Record<string, unknown>;
		expect(stored.squish).toBe(0.85);
		expect(stored.topCvtRatio).toBe(0.94);
		await saveRun(b.id, id, {
			runOn: '2026-05-01',
			speed: 50 + 0.7000000000000001,
			method: 'radar',
			venue: 'closed-course',
			elevation: 200,
			temp: 18.1 + 0.2,
			humidity: 50
		});
		const [run] = await runs.listForBuild(b.id);
		expect(run.speedKmh).toBe(50.7);
		expect(run.tempC).toBe(18.3);
		const doc = JSON.stringify(await exportBuild(b));
		expect(doc).not.toMatch(/\d\.\d*0000000\d/);
		expect(doc).toMatch(/"squish":0\.85[,}]/);
		expect(doc).toMatch(/"topCvtRatio":0\.94[,}]/);
	});

	it('rows saved before the rounding are exported at field precision', async () => {
		const u = await makeUser();
		const b = await builds.create(u.id, { title: 'Old float noise' });
		await setups.create(b.id, 'Stock baseline', true, { squish, topCvtRatio: cvt } as SetupConfig);
		const doc = JSON.stringify(await exportBuild(b));
		expect(doc).toMatch(/"squish":0\.85[,}]/);
		expect(doc).toMatch(/"topCvtRatio":0\.94[,}]/);
	});
});
