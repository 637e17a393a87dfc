// Unit conversion: the project's one home for it. Exact factors from NIST SP 811 (2008),
// Appendix B.8/B.9, except inHg, which is the conventional 0 °C value (NIST lists 3.386389 kPa).
import { finite, nonNegative } from './check';

const KMH_PER_MPH = 1.609344; // 1 mile = 1609.344 m exactly
const M_PER_FT = 0.3048; // exact
const MM_PER_IN = 25.4; // exact
const KPA_PER_INHG = 3.386389; // inHg at 0 °C
const KG_PER_LB = 0.45359237; // exact
const ABS_ZERO_C = -273.15;
const ABS_ZERO_F = -459.67;

/** Speeds are magnitudes here: a negative speed is refused. */
export const mphToKmh = (mph: number) => nonNegative('mph', mph) * KMH_PER_MPH;
export const kmhToMph = (kmh: number) => nonNegative('kmh', kmh) / KMH_PER_MPH;

/** Lengths may be negative (an elevation below sea level). */
export const ftToM = (ft: number) => finite('ft', ft) * M_PER_FT;
export const mToFt = (m: number) => finite('m', m) / M_PER_FT;
export const inToMm = (inches: number) => finite('inches', inches) * MM_PER_IN;
export const mmToIn = (mm: number) => finite('mm', mm) / MM_PER_IN;

export function fToC(f: number): number {
	finite('f', f);
	if (f < ABS_ZERO_F)
		throw new RangeError(`f must not be below absolute zero (${ABS_ZERO_F} °F), got ${f}`);
	return (f - 32) / 1.8;
}
export function cToF(c: number): number {
	finite('c', c);
	if (c < ABS_ZERO_C)
		throw new RangeError(`c must not be below absolute zero (${ABS_ZERO_C} °C), got ${c}`);
	return c * 1.8 + 32;
}

export const inHgToKpa = (inHg: number) => nonNegative('inHg', inHg) * KPA_PER_INHG;
export const kpaToInHg = (kpa: number) => nonNegative('kpa', kpa) / KPA_PER_INHG;

export const lbToKg = (lb: number) => nonNegative('lb', lb) * KG_PER_LB;
export const kgToLb = (kg: number) => nonNegative('kg', kg) / KG_PER_LB;

/** 1 in³ = 16.387064 cm³ exactly (25.4³ mm³). */
export const ccToCubicIn = (cc: number) => nonNegative('cc', cc) / 16.387064;
export const cubicInToCc = (cubicIn: number) => nonNegative('cubicIn', cubicIn) * 16.387064;

/** US liquid gallon = 231 in³ = 3.785411784 L exactly; US fluid ounce = 1/128 gallon. */
const L_PER_GAL = 3.785411784;
const ML_PER_FLOZ = 29.5735295625;
export const galToL = (gal: number) => nonNegative('gal', gal) * L_PER_GAL;
export const lToGal = (l: number) => nonNegative('l', l) / L_PER_GAL;
export const flOzToMl = (flOz: number) => nonNegative('flOz', flOz) * ML_PER_FLOZ;
export const mlToFlOz = (ml: number) => nonNegative('ml', ml) / ML_PER_FLOZ;
