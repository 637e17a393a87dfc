import { describe, expect, it } from 'vitest';
import * as t from '../../../src/lib/tuning';

describe('displacement and compression', () => {
	it('a 47 × 39.2 mm kit is 68.0 cc (worked example)', () => {
		// V = π/4 · B² · S (cylinder volume): 47² = 2209; 2209 × 39.2 = 86,592.8; × π/4 = 68,009.8 mm³ = 68.01 cm³.
		expect(t.displacementCc(47, 39.2)).toBeCloseTo(68.0098, 3);
		// Stock 40 × 39.2 mm: 1600 × 39.2 = 62,720; × π/4 = 49,260.2 mm³ = 49.26 cm³.
		expect(t.displacementCc(40, 39.2)).toBeCloseTo(49.2602, 3);
	});
	it('geometric CR (Vs + Vc)/Vc: 68 cc over a 6.8 cc chamber is 11:1 (Heywood 1988 eq. 2.2)', () => {
		expect(t.geometricCompressionRatio(68, 6.8)).toBeCloseTo(11, 12);
	});
	it('trapped CR: two published worked examples (Blair 1996 defines the ratio)', () => {
		// torqsoft.net compression-ratio programme: 54.0 × 54.5 mm, 8.5 cc head, exhaust 28 mm
		// below TDC → 8.54.
		expect(t.trappedCompressionRatio(54, 54.5, 28, 8.5)).toBeCloseTo(8.54, 2);
		// calcady.com trapped-compression walk-through: 54 × 54 mm, 11.5 cc, roof 25 mm down →
		// 57.25 cc trapped, 5.97:1 (their rounding; 5.979 unrounded).
		expect(t.trappedCompressionRatio(54, 54, 25, 11.5)).toBeCloseTo(5.97, 1);
		expect(Math.abs(t.trappedCompressionRatio(54, 54, 25, 11.5) - 5.97)).toBeLessThan(0.01);
	});
	it('mean piston speed 2·S·N/60: 39.2 mm at 10,000 rpm is 13.07 m/s (Heywood 1988 eq. 2.1)', () => {
		expect(t.meanPistonSpeedMs(39.2, 10000)).toBeCloseTo(13.0667, 4);
	});
	it('refuses bad input with the parameter named', () => {
		expect(() => t.displacementCc(0, 39)).toThrow(/^boreMm/);
		expect(() => t.displacementCc(47, NaN)).toThrow(/^strokeMm/);
		expect(() => t.geometricCompressionRatio(-1, 5)).toThrow(/^sweptCc/);
		expect(() => t.geometricCompressionRatio(50, 0)).toThrow(/^chamberCc/);
		expect(() => t.trappedCompressionRatio(47, 39.2, 40, 6)).toThrow(/^exhaustTopBelowTdcMm/);
		expect(() => t.meanPistonSpeedMs(39.2, 0)).toThrow(/^rpm/);
	});
});

describe('crank-slider (Heywood 1988 eq. 2.5)', () => {
	const S = 39.2;
	const l = 85;
	const r = S / 2;
	it('s(0) = 0, s(180°) = stroke, s(90°) = r + l − √(l² − r²)', () => {
		expect(t.pistonDropMm(0, S, l)).toBeCloseTo(0, 12);
		expect(t.pistonDropMm(180, S, l)).toBeCloseTo(S, 12);
		expect(t.pistonDropMm(90, S, l)).toBeCloseTo(r + l - Math.sqrt(l * l - r * r), 12);
		expect(t.pistonDropMm(360 + 90, S, l)).toBeCloseTo(t.pistonDropMm(90, S, l), 12);
		expect(t.pistonDropMm(-90, S, l)).toBeCloseTo(t.pistonDropMm(270, S, l), 12);
	});
	it('port timing round-trips: the opening angle of the drop at θ is θ', () => {
		for (const theta of [20, 75, 90, 105, 120, 160]) {
			expect(t.portOpenDeg(t.pistonDropMm(theta, S, l), S, l)).toBeCloseTo(theta, 9);
		}
	});
	it('a published drop gives its angle back as port timing (calcady.com: 22° ↔ 2.479 mm, 54 × 100)', () => {
		// A roof 2.479 mm below TDC is uncovered at 22° after TDC and covered 22° before: 316°.
		expect(t.portOpenDeg(2.479, 54, 100)).toBeCloseTo(22, 1);
		expect(t.portDurationDeg(2.479, 54, 100)).toBeCloseTo(316, 0);
	});
	it('duration and its inverse agree', () => {
		const h = t.portTopForDurationDeg(190, S, l);
		expect(t.portDurationDeg(h, S, l)).toBeCloseTo(190, 9);
	});
	it('refuses a rod no longer than half the stroke, and roofs outside the stroke', () => {
		expect(() => t.pistonDropMm(10, S, r)).toThrow(/^rodMm/);
		expect(() => t.pistonDropMm(NaN, S, l)).toThrow(/^crankDegFromTdc/);
		expect(() => t.portOpenDeg(0, S, l)).toThrow(/^portTopBelowTdcMm/);
		expect(() => t.portOpenDeg(S, S, l)).toThrow(/^portTopBelowTdcMm/);
		expect(() => t.portDurationDeg(-1, S, l)).toThrow(/^portTopBelowTdcMm/);
		expect(() => t.portTopForDurationDeg(360, S, l)).toThrow(/^durationDeg/);
	});
});

describe('squish advice (common practice, no published source)', () => {
	it('0.75 mm on a 47 mm bore falls inside the advised range', () => {
		const a = t.squishAdvice(47, 0.75);
		expect(a.verdict).toBe('ok');
		expect(a.minMm).toBeLessThanOrEqual(0.75);
		expect(a.maxMm).toBeGreaterThanOrEqual(0.75);
		expect(a.source).toMatch(/no published source/);
	});
	it('0.5 mm is tight and 1.3 mm loose on the same bore', () => {
		expect(t.squishAdvice(47, 0.5).verdict).toBe('tight');
		expect(t.squishAdvice(47, 1.3).verdict).toBe('loose');
	});
	it('refuses a clearance of zero or less', () => {
		expect(() => t.squishAdvice(47, 0)).toThrow(/^squishMm/);
		expect(() => t.squishAdvice(NaN, 1)).toThrow(/^boreMm/);
	});
});
