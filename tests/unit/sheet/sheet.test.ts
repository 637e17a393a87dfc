import { describe, expect, it } from 'vitest';
import { diffSetups } from '../../../src/lib/sheet/diff';
import { BUILD_FIELDS } from '../../../src/lib/sheet/fields';
import { parseRollers } from '../../../src/lib/sheet/rollers';
import { RUN_FIELDS } from '../../../src/lib/sheet/run-fields';
import { missingFor, schemaFor, toForm, toStored } from '../../../src/lib/sheet/schema';

describe('roller weights', () => {
	it('reads mixed sets and plain lists', () => {
		expect(parseRollers('3x5.0 + 3x4.5').grams).toEqual([5, 5, 5, 4.5, 4.5, 4.5]);
		expect(parseRollers('3 × 5 g + 3 × 4.5 g').grams).toEqual([5, 5, 5, 4.5, 4.5, 4.5]);
		expect(parseRollers('5, 5, 5, 4.5, 4.5, 4.5').grams).toHaveLength(6);
		expect(parseRollers('6x5.5').problem).toBeNull();
	});
	it('says what is wrong', () => {
		expect(parseRollers('6x45').problem).toMatch(/1–30 g/);
		expect(parseRollers('heavy ones').problem).toMatch(/not a weight/);
		expect(parseRollers('1x5').problem).toMatch(/2 to 12 slots/);
	});
});

describe('schemas in the typed units', () => {
	it('checks imperial entries against the metric range and stores them in canonical units', () => {
		const s = schemaFor('run-t', RUN_FIELDS, 'imperial', 'complete');
		const base = {
			runOn: '2026-05-01',
			method: 'radar',
			venue: 'closed-course',
			humidity: 40,
			pressureKind: 'sea-level',
			chtSensor: 'plug-washer'
		};
		// 60 mph = 96.56 km/h; 6,500 ft = 1,981 m; 68 °F = 20 °C.
		const ok = s.safeParse({ ...base, speed: 60, elevation: 6500, temp: 68 });
		expect(ok.success).toBe(true);
		const stored = toStored(RUN_FIELDS, ok.data as never, 'imperial');
		// NIST SP 811: 1 mile = 1.609344 km, so 96.56064 km/h, kept to 0.01 km/h (finer than 0.1 mph).
		expect(stored.speed).toBe(96.56);
		expect(stored.elevation).toBeCloseTo(1981.2, 6); // 1 ft = 0.3048 m
		expect(stored.temp).toBeCloseTo(20, 9);
		// 200 mph is over the 250 km/h ceiling (155.3 mph): refused with the range in mph.
		const bad = s.safeParse({ ...base, speed: 200, elevation: 6500, temp: 68 });
		expect(bad.success).toBe(false);
		expect(bad.error?.issues[0].message).toMatch(/mph/);
	});
	it('round-trips stored values through the form', () => {
		const shown = toForm(RUN_FIELDS, { speed: 96.56064, elevation: 1981.2, temp: 20 }, 'imperial');
		expect(shown).toMatchObject({ speed: 60, elevation: 6500, temp: 68 });
	});
	it('lists what is missing before publishing', () => {
		expect(
			missingFor('build-t', BUILD_FIELDS, {
				title: 'A build',
				engineCycle: 'two-stroke',
				cooling: 'air',
				cylinderOrientation: 'horizontal',
				currency: 'EUR',
				chassis: 'x',
				engineFamily: 'y',
				brakeFront: '',
				brakeRear: 'drum',
				story: ''
			})
		).toEqual(['Front brake']);
	});
});

describe('setup diff', () => {
	it('names each changed field in the reader’s units', () => {
		const a = { bore: 40, exhaustType: 'stock', mainJet: 80, casePorted: false };
		const b = { bore: 47, exhaustType: 'expansion-chamber', mainJet: 80, casePorted: true };
		const metric = diffSetups(a, b, 'metric');
		expect(metric.map((c) => c.field)).toEqual(['bore', 'casePorted', 'exhaustType']); // in sheet order
		expect(metric[0]).toMatchObject({ from: '40.00 mm', to: '47.00 mm' });
		expect(metric[2]).toMatchObject({ from: 'stock', to: 'expansion chamber' });
		expect(diffSetups(a, b, 'imperial')[0]).toMatchObject({ from: '1.5748 in', to: '1.8504 in' });
	});
});

describe('range messages', () => {
	it('say no unit for a jet size (unit "size"), and the unit where there is one', async () => {
		const { schemaFor } = await import('../../../src/lib/sheet/schema');
		const { SETUP_FIELDS } = await import('../../../src/lib/sheet/setup-fields');
		const schema = schemaFor('setup', SETUP_FIELDS, 'metric');
		const r = schema.safeParse({ mainJet: 20 });
		const issue = r.success ? null : r.error.issues.find((i) => i.path[0] === 'mainJet');
		expect(issue?.message).toBe('Between 40 and 300.');
	});
});
