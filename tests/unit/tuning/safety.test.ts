import { describe, expect, it } from 'vitest';
import * as t from '../../../src/lib/tuning';

const codes = (input: t.SpeedWarningInput) => t.speedWarnings(input).map((w) => w.code);

describe('speedWarnings', () => {
	it('flags a speed above the tyre speed symbol (ISO 4000-1: J = 100 km/h)', () => {
		expect(codes({ measuredKmh: 104, tyreSpeedSymbol: 'J' })).toEqual(['tyre-speed-rating']);
		expect(codes({ gearingLimitedKmh: 99, tyreSpeedSymbol: 'J' })).toEqual([]);
		expect(t.speedWarnings({ measuredKmh: 104, tyreSpeedSymbol: 'J' })[0].severity).toBe('danger');
	});
	it('flags more than 1.5 × the stock speed with no brake upgrade recorded', () => {
		expect(codes({ measuredKmh: 90, stockKmh: 55 })).toEqual(['brakes-not-upgraded']);
		expect(codes({ measuredKmh: 90, stockKmh: 55, brakesUpgraded: true })).toEqual([]);
		expect(codes({ measuredKmh: 80, stockKmh: 55 })).toEqual([]);
	});
	it('flags a hot head against the level for its sensor (common practice, no published source)', () => {
		expect(codes({ headTempC: 240 })).toEqual(['head-temperature']);
		expect(codes({ headTempC: 200 })).toEqual([]);
		expect(codes({ headTempC: 100, headTempSensor: 'coolant' })).toEqual(['head-temperature']);
	});
	it('flags a jet leaner than the change of air suggests', () => {
		// Same air: the physics keeps 100; a 94 is leaner than that.
		const air = { elevationM: 0, tempC: 15, relativeHumidity: 0.5 };
		const j = { fromSize: 100, from: air, to: air };
		expect(codes({ jetChange: { ...j, toSize: 94 } })).toEqual(['leaner-than-physics']);
		expect(codes({ jetChange: { ...j, toSize: 100 } })).toEqual([]);
		expect(codes({ jetChange: { ...j, toSize: 104 } })).toEqual([]);
	});
	it('refuses bad input, naming the parameter', () => {
		expect(() => t.speedWarnings({ measuredKmh: NaN })).toThrow(/^measuredKmh/);
		expect(() => t.speedWarnings({ gearingLimitedKmh: -3 })).toThrow(/^gearingLimitedKmh/);
		expect(() => t.speedWarnings({ stockKmh: 0 })).toThrow(/^stockKmh/);
		expect(() => t.speedWarnings({ measuredKmh: 90, tyreSpeedSymbol: 'Ä' })).toThrow(/^letter/);
		expect(() => t.speedWarnings({ headTempC: NaN })).toThrow(/^headTempC/);
		expect(() => t.speedWarnings({ headTempC: 90, headTempSensor: 'thumb' as never })).toThrow(
			/^headTempSensor/
		);
		expect(() =>
			t.speedWarnings({
				jetChange: {
					fromSize: 100,
					toSize: -1,
					from: { elevationM: 0, tempC: 15, relativeHumidity: 0 },
					to: { elevationM: 0, tempC: 15, relativeHumidity: 0 }
				}
			})
		).toThrow(/^jetChange.toSize/);
	});
});
