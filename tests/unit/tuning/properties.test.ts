import fc from 'fast-check';
import { describe, it } from 'vitest';
import * as t from '../../../src/lib/tuning';

const close = (a: number, b: number) =>
	Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
const num = (min: number, max: number) =>
	fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

describe('properties (fast-check)', () => {
	it('every unit pair round-trips', () => {
		const pairs: [(x: number) => number, (x: number) => number, number, number][] = [
			[t.mphToKmh, t.kmhToMph, 0, 1e4],
			[t.ftToM, t.mToFt, -1e5, 1e5],
			[t.inToMm, t.mmToIn, -1e4, 1e4],
			[t.fToC, t.cToF, -459.67, 1e4],
			[t.inHgToKpa, t.kpaToInHg, 0, 1e3],
			[t.lbToKg, t.kgToLb, 0, 1e5],
			[t.ccToCubicIn, t.cubicInToCc, 0, 1e5]
		];
		for (const [there, back, min, max] of pairs) {
			fc.assert(fc.property(num(min, max), (x) => close(back(there(x)), x)));
		}
	});

	it('rpmAtSpeed inverts roadSpeedKmh', () => {
		fc.assert(
			fc.property(num(100, 20000), num(1, 40), num(500, 3000), (rpm, i, c) =>
				close(t.rpmAtSpeed(t.roadSpeedKmh(rpm, i, c), i, c), rpm)
			)
		);
	});

	it('denser air never suggests a smaller jet', () => {
		fc.assert(
			fc.property(
				num(20, 300),
				num(0.5, 1.4),
				num(0.5, 1.4),
				fc.constantFrom('diameter', 'flow'),
				(jet, a, b, n) => {
					const [lo, hi] = a <= b ? [a, b] : [b, a];
					return (
						t.retargetJet(jet, 1.1, hi, n as t.JetNumbering) >=
						t.retargetJet(jet, 1.1, lo, n as t.JetNumbering)
					);
				}
			)
		);
	});

	it('more teeth on a driven gear never raises speed', () => {
		fc.assert(
			fc.property(
				fc.integer({ min: 8, max: 30 }),
				fc.integer({ min: 20, max: 60 }),
				fc.integer({ min: 1, max: 10 }),
				num(3000, 12000),
				(driver, driven, more, rpm) =>
					t.gearingLimitedSpeedKmh(rpm, 0.9, [[driver, driven + more]], '120/70-12') <=
					t.gearingLimitedSpeedKmh(rpm, 0.9, [[driver, driven]], '120/70-12')
			)
		);
	});

	it('port timing round-trips for any rod and roof', () => {
		fc.assert(
			fc.property(num(30, 60), num(1.6, 2.4), num(0.05, 0.95), (stroke, rodFactor, frac) => {
				const rod = stroke * rodFactor;
				const h = stroke * frac;
				return close(t.pistonDropMm(t.portOpenDeg(h, stroke, rod), stroke, rod), h);
			})
		);
	});
});
