// Canonical units in the database (mm, cc, km/h, m, °C, kg, kPa) and the reader's units on screen.
import { fixed } from '../intl';
import * as t from '../tuning';

export type Units = 'metric' | 'imperial';
export type Dim = 'length' | 'speed' | 'elevation' | 'temp' | 'mass' | 'pressure';

export const UNIT: Record<Dim, Record<Units, string>> = {
	length: { metric: 'mm', imperial: 'in' },
	speed: { metric: 'km/h', imperial: 'mph' },
	elevation: { metric: 'm', imperial: 'ft' },
	temp: { metric: '°C', imperial: '°F' },
	mass: { metric: 'kg', imperial: 'lb' },
	pressure: { metric: 'kPa', imperial: 'inHg' }
};

/** Canonical → shown. */
export const TO_IMPERIAL: Record<Dim, (x: number) => number> = {
	length: t.mmToIn,
	speed: t.kmhToMph,
	elevation: t.mToFt,
	temp: t.cToF,
	mass: t.kgToLb,
	pressure: t.kpaToInHg
};

/** Shown → canonical. */
export const TO_METRIC: Record<Dim, (x: number) => number> = {
	length: t.inToMm,
	speed: t.mphToKmh,
	elevation: t.ftToM,
	temp: t.fToC,
	mass: t.lbToKg,
	pressure: t.inHgToKpa
};

/** Decimals that keep a converted value as precise as what was typed. */
export const PLACES: Record<Dim, Record<Units, number>> = {
	length: { metric: 2, imperial: 4 },
	speed: { metric: 1, imperial: 1 },
	elevation: { metric: 0, imperial: 0 },
	temp: { metric: 1, imperial: 1 },
	mass: { metric: 1, imperial: 1 },
	pressure: { metric: 1, imperial: 2 }
};

/** Decimals kept in the database (canonical units): fine enough to hold what was typed in either
 * system (0.0001 in = 0.00254 mm, 0.1 mph = 0.16 km/h, 1 ft = 0.3 m, 0.1 °F = 0.056 °C,
 * 0.1 lb = 0.045 kg, 0.01 inHg = 0.034 kPa), and no finer, so sums like 0.8 + 0.05 do not leak. */
export const STORED_PLACES: Record<Dim, number> = {
	length: 3,
	speed: 2,
	elevation: 1,
	temp: 2,
	mass: 2,
	pressure: 2
};

export const toShown = (v: number, dim: Dim, units: Units) =>
	units === 'imperial' ? TO_IMPERIAL[dim](v) : v;
export const toCanonical = (v: number, dim: Dim, units: Units) =>
	units === 'imperial' ? TO_METRIC[dim](v) : v;

/** A canonical value as the reader sees it, with its unit. */
export function show(
	v: number | null | undefined,
	dim: Dim,
	units: Units,
	places?: number
): string {
	if (v === null || v === undefined || !Number.isFinite(v)) return '—';
	return `${fixed(toShown(v, dim, units), places ?? PLACES[dim][units])} ${UNIT[dim][units]}`;
}
