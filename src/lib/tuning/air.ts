// Air: the standard atmosphere, humidity and density.
import { between } from './check';

// ISO 2533:1975 / ICAO Doc 7488 constants (identical to U.S. Standard Atmosphere 1976 below 32 km).
const T0 = 288.15; // K
const P0 = 101325; // Pa
const L = 0.0065; // K/m, troposphere lapse rate
const G0 = 9.80665; // m/s²
const R_AIR = 287.05287; // J/(kg·K), ISO 2533 specific gas constant of dry air
const R0 = 6356766; // m, earth radius used for geopotential height
const EXP = G0 / (R_AIR * L); // ≈ 5.25588
/** ISA sea-level density, kg/m³. */
export const ISA_SEA_LEVEL_DENSITY = P0 / (R_AIR * T0); // 1.2250

// Moist air as an ideal-gas mixture (CIPM-2007 adds ~0.04 % with compressibility).
const RD = 287.058; // J/(kg·K) dry air
const RV = 461.495; // J/(kg·K) water vapour

export type Atmosphere = { temperatureK: number; pressurePa: number; densityKgM3: number };

/** Geopotential height H = r0·Z / (r0 + Z) for geometric altitude Z (ISO 2533). */
const geopotential = (z: number) => (R0 * z) / (R0 + z);

/** ISO 2533 standard atmosphere in the troposphere, for geometric altitude −500 to 11,000 m. */
export function isaAtmosphere(altitudeM: number): Atmosphere {
	between('altitudeM', altitudeM, -500, 11000);
	const h = geopotential(altitudeM);
	const temperatureK = T0 - L * h;
	const pressurePa = P0 * Math.pow(temperatureK / T0, EXP);
	return { temperatureK, pressurePa, densityKgM3: pressurePa / (R_AIR * temperatureK) };
}

/** Saturation vapour pressure over water, Buck, J. Appl. Meteorol. 20 (1981) 1527 (1996 form), Pa. */
export function saturationVapourPressurePa(tempC: number): number {
	between('tempC', tempC, -80, 100);
	return 611.21 * Math.exp((18.678 - tempC / 234.5) * (tempC / (257.14 + tempC)));
}

export type MoistAir = {
	/** Partial pressure of the water vapour, Pa. */
	vapourPressurePa: number;
	/** Mass of dry air per volume of the mixture (the part that carries oxygen), kg/m³. */
	dryDensityKgM3: number;
	/** Dry air and vapour together, kg/m³. */
	densityKgM3: number;
};

/**
 * Moist air as two ideal gases sharing the pressure: ρ_dry = (p − pv)/(Rd·T),
 * ρ = ρ_dry + pv/(Rv·T), pv = RH · es(t).
 */
export function moistAir(pressurePa: number, tempC: number, relativeHumidity: number): MoistAir {
	between('pressurePa', pressurePa, 1000, 200000);
	between('tempC', tempC, -80, 100);
	between('relativeHumidity', relativeHumidity, 0, 1);
	const pv = relativeHumidity * saturationVapourPressurePa(tempC);
	if (pv >= pressurePa)
		throw new RangeError(
			`pressurePa must exceed the vapour pressure (${pv.toFixed(0)} Pa) at that temperature and humidity`
		);
	const t = tempC + 273.15;
	const dry = (pressurePa - pv) / (RD * t);
	return { vapourPressurePa: pv, dryDensityKgM3: dry, densityKgM3: dry + pv / (RV * t) };
}

/** Total density of moist air ρ = (p − pv)/(Rd·T) + pv/(Rv·T), pv = RH · es(t). */
export function moistAirDensity(
	pressurePa: number,
	tempC: number,
	relativeHumidity: number
): number {
	return moistAir(pressurePa, tempC, relativeHumidity).densityKgM3;
}

/** The ISA altitude with the same density (AMS Glossary): DA = 44330.8 · [1 − (ρ/1.225)^0.234969] m. */
export function densityAltitudeM(densityKgM3: number): number {
	between('densityKgM3', densityKgM3, 0.05, 2);
	return 44330.8 * (1 - Math.pow(densityKgM3 / 1.225, 0.234969));
}

/**
 * Station pressure from a sea-level (QNH) reading, by the ISA altimeter-setting relation:
 * p = QNH · (1 − L·H/T0)^(g0/(R·L)), H the geopotential elevation.
 */
export function stationPressureFromSeaLevel(seaLevelPa: number, elevationM: number): number {
	between('seaLevelPa', seaLevelPa, 80000, 110000);
	between('elevationM', elevationM, -500, 11000);
	return seaLevelPa * Math.pow(1 - (L * geopotential(elevationM)) / T0, EXP);
}

export type AirConditions = {
	elevationM: number;
	tempC: number;
	relativeHumidity: number;
	pressurePa?: number;
	/** What a given pressure is: measured at the place ('station', the default) or the weather report's sea-level value. */
	pressureKind?: 'station' | 'sea-level';
};

export type Air = MoistAir & { densityAltitudeM: number; pressurePa: number };

/** Air at a place: the given pressure (converted from sea level if so marked) or ISA pressure at that elevation. */
export function airAt(conditions: AirConditions): Air {
	if (!conditions || typeof conditions !== 'object')
		throw new RangeError('conditions must be an object');
	const { elevationM, tempC, relativeHumidity, pressurePa, pressureKind = 'station' } = conditions;
	between('elevationM', elevationM, -500, 11000);
	if (pressureKind !== 'station' && pressureKind !== 'sea-level')
		throw new RangeError(`pressureKind must be 'station' or 'sea-level'`);
	let p: number;
	if (pressurePa === undefined) p = isaAtmosphere(elevationM).pressurePa;
	else if (pressureKind === 'sea-level') p = stationPressureFromSeaLevel(pressurePa, elevationM);
	else p = between('pressurePa', pressurePa, 1000, 200000);
	const air = moistAir(p, tempC, relativeHumidity);
	return { ...air, densityAltitudeM: densityAltitudeM(air.densityKgM3), pressurePa: p };
}

/**
 * SAE J1349 power correction to 99 kPa dry air and 25 °C:
 * CF = 1.18 · (99/pd) · √((t + 273)/298) − 0.18, pd dry-air pressure in kPa.
 */
export function powerCorrectionFactor(dryPressureKpa: number, tempC: number): number {
	between('dryPressureKpa', dryPressureKpa, 50, 110);
	between('tempC', tempC, -40, 60);
	return 1.18 * (99 / dryPressureKpa) * Math.sqrt((tempC + 273) / 298) - 0.18;
}

/** Dry-air partial pressure (kPa) for J1349: total pressure less the vapour pressure. */
export function dryAirPressureKpa(
	pressurePa: number,
	tempC: number,
	relativeHumidity: number
): number {
	return (pressurePa - moistAir(pressurePa, tempC, relativeHumidity).vapourPressurePa) / 1000;
}
