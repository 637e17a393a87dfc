import { describe, expect, it } from 'vitest';
import * as u from '../../../src/lib/tuning';

describe('unit conversions (NIST SP 811, Appendix B: exact factors)', () => {
	it('uses the exact factors', () => {
		expect(u.mphToKmh(1)).toBe(1.609344); // NIST SP 811 B.8: 1 mile = 1.609344 km exactly
		expect(u.ftToM(1)).toBe(0.3048); // NIST SP 811 B.8: 1 ft = 0.3048 m exactly
		expect(u.inToMm(1)).toBe(25.4); // NIST SP 811 B.8: 1 in = 2.54 cm exactly
		expect(u.lbToKg(1)).toBe(0.45359237); // NIST SP 811 B.8: 1 lb (avoirdupois) = 0.45359237 kg exactly
		expect(u.inHgToKpa(1)).toBeCloseTo(3.386389, 9); // NIST SP 811 B.8: inch of mercury (0 °C) = 3.386389 kPa
		expect(u.fToC(212)).toBeCloseTo(100, 12); // NIST SP 811 B.9: t/°C = (t/°F − 32)/1.8
		expect(u.cToF(-40)).toBeCloseTo(-40, 12); // same relation; −40 is where the scales meet
		expect(u.mphToKmh(45 / 1.609344)).toBeCloseTo(45, 12);
		expect(u.cubicInToCc(1)).toBeCloseTo(16.387064, 12); // NIST SP 811 B.8: 1 in³ = 16.387064 cm³ exactly
	});

	it('refuses NaN and physically impossible values, naming the parameter', () => {
		expect(() => u.mphToKmh(NaN)).toThrow(/^mph/);
		expect(() => u.kmhToMph(-1)).toThrow(RangeError);
		expect(() => u.ftToM(Infinity)).toThrow(/^ft/);
		expect(() => u.mToFt(NaN)).toThrow(/^m /);
		expect(() => u.fToC(-500)).toThrow(/^f /);
		expect(() => u.cToF(-300)).toThrow(/^c /);
		expect(() => u.inHgToKpa(-1)).toThrow(/^inHg/);
		expect(() => u.kpaToInHg(NaN)).toThrow(/^kpa/);
		expect(() => u.lbToKg(-2)).toThrow(/^lb/);
		expect(() => u.kgToLb(-2)).toThrow(/^kg/);
		expect(() => u.inToMm(NaN)).toThrow(/^inches/);
		expect(() => u.mmToIn(NaN)).toThrow(/^mm/);
	});
	it('accepts a negative elevation (a place below sea level)', () => {
		expect(u.mToFt(-100)).toBeCloseTo(-328.084, 3);
	});
});
