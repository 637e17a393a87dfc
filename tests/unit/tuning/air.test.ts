import psychrolib from 'psychrolib';
import { describe, expect, it } from 'vitest';
import * as t from '../../../src/lib/tuning';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('ISO 2533 / ICAO standard atmosphere (geometric altitude)', () => {
	// [altitude m, T K, p Pa, ρ kg/m³]
	const table: [number, number, number, number][] = [
		[0, 288.15, 101325, 1.225], // ISO 2533 sea-level values (REFERENCES.md)
		[500, 284.9, 95461, 1.1673], // U.S. Standard Atmosphere 1976 table (from memory)
		[1000, 281.65, 89874.6, 1.11164], // ISO 2533 / ICAO table (REFERENCES.md)
		[1500, 278.4, 84556, 1.0581], // U.S. Standard Atmosphere 1976 table (from memory)
		[2000, 275.15, 79495, 1.0065], // U.S. Standard Atmosphere 1976 table (from memory)
		[3000, 268.66, 70108, 0.90913] // U.S. Standard Atmosphere 1976 table (from memory)
	];
	it.each(table)('%i m within 0.1 %', (z, T, p, rho) => {
		const a = t.isaAtmosphere(z);
		expect(rel(a.temperatureK, T)).toBeLessThan(0.001);
		expect(rel(a.pressurePa, p)).toBeLessThan(0.001);
		expect(rel(a.densityKgM3, rho)).toBeLessThan(0.001);
	});
	it('refuses altitudes outside −500…11,000 m', () => {
		expect(() => t.isaAtmosphere(12000)).toThrow(/^altitudeM/);
		expect(() => t.isaAtmosphere(NaN)).toThrow(/^altitudeM/);
	});
});

describe('humidity and density', () => {
	it('Buck (1981): saturation vapour pressure 2.339 kPa at 20 °C, within 0.5 %', () => {
		expect(rel(t.saturationVapourPressurePa(20), 2339)).toBeLessThan(0.005); // standard steam-table value, REFERENCES.md
	});

	it('moist-air density matches psychrolib (ASHRAE psychrometrics) within 0.2 % over a grid', () => {
		psychrolib.SetUnitSystem(psychrolib.SI);
		for (const p of [70000, 85000, 101325]) {
			for (const tc of [-10, 5, 20, 35]) {
				for (const rh of [0, 0.4, 0.9]) {
					const w = psychrolib.GetHumRatioFromRelHum(tc, rh, p);
					const ref = psychrolib.GetMoistAirDensity(tc, w, p);
					expect(rel(t.moistAirDensity(p, tc, rh), ref), `${p} Pa ${tc} °C ${rh}`).toBeLessThan(
						0.002
					);
				}
			}
		}
	});

	it('density altitude of the ISA density is the altitude itself (AMS Glossary formula)', () => {
		expect(t.densityAltitudeM(1.225)).toBeCloseTo(0, 6);
		expect(Math.abs(t.densityAltitudeM(t.isaAtmosphere(1500).densityKgM3) - 1500)).toBeLessThan(5);
	});

	it('station pressure from a sea-level reading equals ISA pressure when QNH is standard', () => {
		expect(
			rel(t.stationPressureFromSeaLevel(101325, 1000), t.isaAtmosphere(1000).pressurePa)
		).toBeLessThan(1e-12);
	});

	it('airAt uses ISA pressure when none is given, and converts a sea-level reading', () => {
		const a = t.airAt({ elevationM: 1000, tempC: 15, relativeHumidity: 0 });
		expect(a.pressurePa).toBeCloseTo(t.isaAtmosphere(1000).pressurePa, 6);
		const b = t.airAt({
			elevationM: 1000,
			tempC: 15,
			relativeHumidity: 0,
			pressurePa: 101325,
			pressureKind: 'sea-level'
		});
		expect(b.pressurePa).toBeCloseTo(a.pressurePa, 6);
		const c = t.airAt({ elevationM: 1000, tempC: 15, relativeHumidity: 0, pressurePa: 90000 });
		expect(c.pressurePa).toBe(90000);
	});

	it('SAE J1349 correction is exactly 1 at its reference (99 kPa dry, 25 °C)', () => {
		expect(t.powerCorrectionFactor(99, 25)).toBeCloseTo(1, 12); // SAE J1349: CF = 1.18·(99/pd)·√((t+273)/298) − 0.18
	});

	it('refuses impossible air, naming the parameter', () => {
		expect(() => t.saturationVapourPressurePa(150)).toThrow(/^tempC/);
		expect(() => t.moistAirDensity(0, 20, 0.5)).toThrow(/^pressurePa/);
		expect(() => t.moistAirDensity(101325, 20, 1.5)).toThrow(/^relativeHumidity/);
		expect(() => t.densityAltitudeM(-1)).toThrow(/^densityKgM3/);
		expect(() => t.stationPressureFromSeaLevel(50, 100)).toThrow(/^seaLevelPa/);
		expect(() => t.airAt({ elevationM: NaN, tempC: 20, relativeHumidity: 0.5 })).toThrow(
			/^elevationM/
		);
		expect(() => t.powerCorrectionFactor(NaN, 25)).toThrow(/^dryPressureKpa/);
	});
});
