import { describe, expect, it } from 'vitest';
import * as t from '../../../src/lib/tuning';

const isa = (z: number) => t.isaAtmosphere(z).densityKgM3;

describe('main-jet retargeting (metering relation, Heywood 1988 §7.2: jet area ∝ √ρ_air)', () => {
	it('diameter-numbered size scales with ρ^¼, flow-numbered with ρ^½', () => {
		expect(t.retargetJet(100, 1.2, 1.2 * 0.8)).toBeCloseTo(100 * Math.pow(0.8, 0.25), 12);
		expect(t.retargetJet(100, 1.2, 1.2 * 0.8, 'flow')).toBeCloseTo(100 * Math.sqrt(0.8), 12);
	});
	it('moving to sea level from 1,500 m ISA means a richer jet', () => {
		const cond = {
			elevationM: 1500,
			tempC: t.isaAtmosphere(1500).temperatureK - 273.15,
			relativeHumidity: 0
		};
		const sl = t.seaLevelEquivalentJet(95, cond);
		expect(sl).toBeGreaterThan(95);
		// Dry air on both sides: the dry-air basis is the familiar √ρ for the area, ρ^¼ for the size.
		expect(sl).toBeCloseTo(95 * Math.pow(1.225 / t.airAt(cond).densityKgM3, 0.25), 3);
	});

	// Common practice, no published source: about one main-jet size leaner per 1,000 ft of climb.
	it('the rule of thumb: one step per 1,000 ft, leaner up and richer down', () => {
		expect(t.ruleOfThumbJet(100, 0, 304.8, 2)).toBeCloseTo(98, 12);
		expect(t.ruleOfThumbJet(100, 609.6, 0, 2.5)).toBeCloseTo(105, 12);
	});
	it('for a diameter-numbered 100 over 1,000 ft the rule moves 2–3 times as far as the physics', () => {
		// Rule: 100 → 98 (step 2). Physics: 100 · (ρ(304.8 m)/ρ(0))^¼ = 100 · 0.97063^¼ ≈ 99.26.
		const physics = t.retargetJet(100, isa(0), isa(304.8));
		expect(physics).toBeCloseTo(99.26, 1);
		const rule = t.ruleOfThumbJet(100, 0, 304.8, 2);
		const ratio = (100 - rule) / (100 - physics);
		expect(ratio).toBeGreaterThan(2);
		expect(ratio).toBeLessThan(3);
	});

	it('refuses bad input, naming the parameter', () => {
		expect(() => t.retargetJet(0, 1.2, 1.1)).toThrow(/^jetSize/);
		expect(() => t.retargetJet(100, NaN, 1.1)).toThrow(/^fromDensity/);
		expect(() => t.retargetJet(100, 1.2, 5)).toThrow(/^toDensity/);
		expect(() => t.retargetJet(100, 1.2, 1.1, 'size' as never)).toThrow(/^numbering/);
		expect(() =>
			t.seaLevelEquivalentJet(-1, { elevationM: 0, tempC: 15, relativeHumidity: 0 })
		).toThrow(/^jetSize/);
		expect(() => t.ruleOfThumbJet(100, 0, 300, 0)).toThrow(/^stepSize/);
		expect(() => t.ruleOfThumbJet(10, 0, 9000, 2)).toThrow(/^toElevationM/);
		expect(() => t.jetOnLadder(85, NaN, 2)).toThrow(/^exactSize/);
		expect(() => t.jetOnLadder(85, 80, -2)).toThrow(/^step/);
		expect(() => t.jetOnLadder(0, 80, 2)).toThrow(/^currentJet/);
	});
});
