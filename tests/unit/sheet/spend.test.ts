import { describe, expect, it } from 'vitest';
import { spendBySetup } from '../../../src/lib/sheet/spend';

// Worked by hand: stock 50.0 km/h; setup 2 (kit €189 + pipe €149.50) 98.0 km/h → gain 48.0,
// 33,850 / 48 = 705.2 cents per km/h; setup 3 (rollers €12, no run) → no gain known; setup 4
// (jet €4, 99.5 km/h, measured after setup 2's 98.0) → gain 1.5, 400 / 1.5 = 266.7 cents per km/h.
const setups = [
	{ id: 11, position: 1, changeNote: 'Stock baseline', best: { speedKmh: 50 } },
	{ id: 12, position: 2, changeNote: 'Kit and pipe', best: { speedKmh: 98 } },
	{ id: 13, position: 3, changeNote: 'Lighter rollers', best: null },
	{ id: 14, position: 4, changeNote: 'Jet 92', best: { speedKmh: 99.5 } }
];
const part = (id: number, costMinor: number, setupId: number | null) => ({
	id,
	name: `p${id}`,
	category: 'other',
	costMinor,
	link: null,
	setupId
});

describe('spend by setup', () => {
	it('groups parts under the step that fitted them, with what that step gave', () => {
		const steps = spendBySetup(setups, [
			part(1, 18900, 12),
			part(2, 14950, 12),
			part(3, 1200, 13),
			part(4, 400, 14),
			part(5, 2500, null)
		]);
		expect(steps.map((s) => s.setup?.position ?? null)).toEqual([2, 3, 4, null]);
		expect(steps[0].costMinor).toBe(33850);
		expect(steps[0].gainKmh).toBe(48);
		expect(steps[0].costPerKmhMinor).toBeCloseTo(705.2083, 3);
		expect(steps[1].gainKmh).toBeNull();
		expect(steps[2].gainKmh).toBeCloseTo(1.5, 9);
		expect(steps[2].costPerKmhMinor).toBeCloseTo(266.667, 3);
		expect(steps[3]).toMatchObject({ setup: null, costMinor: 2500, gainKmh: null });
	});

	it('a step that lost speed has no cost per km/h', () => {
		const [s] = spendBySetup(
			[
				{ id: 1, position: 1, changeNote: 'a', best: { speedKmh: 60 } },
				{ id: 2, position: 2, changeNote: 'b', best: { speedKmh: 58 } }
			],
			[part(9, 1000, 2)]
		);
		expect(s.gainKmh).toBe(-2);
		expect(s.costPerKmhMinor).toBeNull();
	});
});
