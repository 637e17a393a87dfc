import { describe, expect, it } from 'vitest';
import * as t from '../../../src/lib/tuning';

describe('gearing and road speed: v = rpm · C · 60 / (1000 · i)', () => {
	it('a worked example, arithmetic spelled out', () => {
		// Stages 13→43 and 13→47: 43/13 × 47/13 = 3.307692 × 3.615385 = 11.958580.
		const fd = t.finalDriveRatio([
			[13, 43],
			[13, 47]
		]);
		expect(fd).toBeCloseTo(2021 / 169, 12);
		// × CVT top 0.95 → 11.360651 engine turns per wheel turn.
		const i = t.overallReduction(0.95, [
			[13, 43],
			[13, 47]
		]);
		expect(i).toBeCloseTo((0.95 * 2021) / 169, 12);
		// 120/70-12: D = 25.4·12 + 2·120·0.70 = 304.8 + 168 = 472.8 mm; C = π·472.8 = 1485.35 mm.
		const c = t.tyreCircumferenceMm('120/70-12');
		// 7000 / 11.360651 = 616.16 wheel rpm; × 1.48535 m = 915.20 m/min; × 60 / 1000 = 54.91 km/h.
		expect(t.roadSpeedKmh(7000, i, c)).toBeCloseTo(
			(7000 / ((0.95 * 2021) / 169)) * (Math.PI * 0.4728) * 0.06,
			9
		);
		expect(t.roadSpeedKmh(7000, i, c)).toBeCloseTo(54.913, 2);
	});

	it('no stages is a ratio of 1', () => {
		expect(t.finalDriveRatio([])).toBe(1);
	});

	// Common practice, no published source: "a 70 cc kit roughly doubles a 50 cc scooter's top
	// speed". Fixed inputs: stock 50 cc at 7,000 rpm, CVT top 0.95, 13→43 and 13→47; kit at
	// 10,500 rpm, CVT top 0.82 (a sport variator), 15→43 and 13→47; both on 120/70-12.
	it('stock about 55 km/h, kit about 110 km/h (each ±5 %)', () => {
		const stock = t.gearingLimitedSpeedKmh(
			7000,
			0.95,
			[
				[13, 43],
				[13, 47]
			],
			'120/70-12'
		);
		const kit = t.gearingLimitedSpeedKmh(
			10500,
			0.82,
			[
				[15, 43],
				[13, 47]
			],
			'120/70-12'
		);
		expect(Math.abs(stock / 55 - 1)).toBeLessThan(0.05);
		expect(Math.abs(kit / 110 - 1)).toBeLessThan(0.05);
		expect(kit / stock).toBeGreaterThan(1.8);
	});

	it('rpmAtSpeed inverts roadSpeedKmh', () => {
		expect(t.rpmAtSpeed(t.roadSpeedKmh(8000, 9, 1480), 9, 1480)).toBeCloseTo(8000, 9);
	});

	it('refuses bad input, naming the parameter', () => {
		expect(() => t.finalDriveRatio([[0, 40]])).toThrow(/^stages\[0\]/);
		expect(() =>
			t.finalDriveRatio([
				[13, 40],
				[13.5, 40]
			])
		).toThrow(/^stages\[1\]/);
		expect(() => t.overallReduction(0, [])).toThrow(/^cvtRatio/);
		expect(() => t.roadSpeedKmh(NaN, 9, 1480)).toThrow(/^rpm/);
		expect(() => t.roadSpeedKmh(8000, -9, 1480)).toThrow(/^overallReduction/);
		expect(() => t.roadSpeedKmh(8000, 9, 0)).toThrow(/^circumferenceMm/);
		expect(() => t.rpmAtSpeed(0, 9, 1480)).toThrow(/^kmh/);
		expect(() => t.gearingLimitedSpeedKmh(0, 0.9, [], 1400)).toThrow(/^peakRpm/);
		expect(() => t.gearingLimitedSpeedKmh(8000, 0.9, [], -5)).toThrow(
			/^tyreDesignationOrCircumferenceMm/
		);
		expect(() => t.gearingLimitedSpeedKmh(8000, 0.9, [], 'flat')).toThrow(/^designation/);
	});
});
