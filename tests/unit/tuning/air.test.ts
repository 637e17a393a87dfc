import psychrolib from 'psychrolib';
import { describe, expect, it } from 'vitest';
import * as t from '../../../src/lib/tuning';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('ISO 2533 / ICAO standard atmosphere (geometric altitude)', () => {
	it('sea level and 1,000 m match the ISO 2533 / ICAO table (REFERENCES.md)', () => {
		for (const [z, T, p, rho] of [
			[0, 288.15, 101325, 1.225],
			[1000, 281.65, 89874.6, 1.11164]
		]) {
			const a = t.isaAtmosphere(z);
			expect(rel(a.temperatureK, T)).toBeLessThan(0.0001);
			expect(rel(a.pressurePa, p)).toBeLessThan(0.0001);
			expect(rel(a.densityKgM3, rho)).toBeLessThan(0.0001);
		}
	});
	// psychrolib's standard atmosphere (ASHRAE Handbook Fundamentals, ch. 1, eqs. 3–4): an outside
	// implementation of the same troposphere, on geometric altitude, so within 0.05 % to 4,000 m.
	it.each([-300, 500, 1500, 2000, 3000, 4000])('%i m matches psychrolib within 0.05 %', (z) => {
		psychrolib.SetUnitSystem(psychrolib.SI);
		const a = t.isaAtmosphere(z);
		expect(rel(a.pressurePa, psychrolib.GetStandardAtmPressure(z))).toBeLessThan(0.0005);
		expect(rel(a.temperatureK, psychrolib.GetStandardAtmTemperature(z) + 273.15)).toBeLessThan(
			0.0005
		);
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
	it('SAE J1349 off the reference agrees with the standard’s inch-pound form', () => {
		// SAE J1349 in inch-pound units (from memory): CF = 1.18·(29.23/Pd)·√((T + 460)/537) − 0.18,
		// Pd in inHg, T in °F (29.23 inHg = 99 kPa, 537 °R = 77 °F = 25 °C). Evaluated on its own.
		for (const [kpa, c] of [
			[85, 30],
			[95, 5],
			[101.3, 15.6],
			[70, 35]
		]) {
			const inHg = kpa / 3.386389;
			const f = c * 1.8 + 32;
			const ip = 1.18 * (29.23 / inHg) * Math.sqrt((f + 460) / 537) - 0.18;
			expect(Math.abs(t.powerCorrectionFactor(kpa, c) - ip), `${kpa} kPa ${c} °C`).toBeLessThan(
				0.002
			);
		}
	});
	it('saturation vapour pressure over water matches psychrolib (ASHRAE, Hyland–Wexler) within 0.3 %', () => {
		psychrolib.SetUnitSystem(psychrolib.SI);
		// Above 0 °C only: below it psychrolib gives the pressure over ice, Buck's form over water.
		for (const c of [0.01, 10, 20, 30, 40, 50, 60, 80])
			expect(
				rel(t.saturationVapourPressurePa(c), psychrolib.GetSatVapPres(c)),
				`${c} °C`
			).toBeLessThan(0.003);
	});
	it('dry-air density is the moist density over (1 + humidity ratio) (psychrolib)', () => {
		psychrolib.SetUnitSystem(psychrolib.SI);
		for (const [p, c, rh] of [
			[101325, 30, 0.9],
			[85000, 20, 0.5],
			[95000, 5, 1]
		]) {
			const w = psychrolib.GetHumRatioFromRelHum(c, rh, p);
			const dry = psychrolib.GetMoistAirDensity(c, w, p) / (1 + w);
			expect(rel(t.moistAir(p, c, rh).dryDensityKgM3, dry)).toBeLessThan(0.002);
		}
	});
	it('dryAirPressureKpa refuses vapour above the total pressure (a bug fixed)', () => {
		// At 90 °C and 100 % RH the vapour pressure is about 70 kPa: 50 kPa of total cannot hold it.
		expect(() => t.dryAirPressureKpa(50000, 90, 1)).toThrow(/^pressurePa/);
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
