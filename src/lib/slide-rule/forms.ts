// How each calculator's form looks: fields, units by system, and starting values.
import * as t from '../tuning';
import type { Units } from './types';

/** What a number measures, so switching metric ↔ imperial converts what was typed. */
export type Dimension = 'length' | 'elevation' | 'temp' | 'pressure' | 'speed' | 'volume' | 'none';

export type FieldDef = {
	name: string;
	label: string;
	kind: 'number' | 'text' | 'select' | 'checkbox';
	dim?: Dimension;
	/** Unit shown after the label when dim is 'none'. */
	unit?: string;
	hint?: string;
	options?: { value: string; label: string }[];
	optional?: boolean;
	/** A select whose value `modeValue` ('duration' unless given) turns this length into degrees. */
	modeField?: string;
	modeValue?: string;
	group: string;
};

/** The dimension a field has right now (a port given as a duration is in degrees). */
const inDegrees = (f: FieldDef, values: FormValues) =>
	!!f.modeField && values[f.modeField] === (f.modeValue ?? 'duration');

export function dimOf(f: FieldDef, values: FormValues): Dimension {
	if (inDegrees(f, values)) return 'none';
	return f.dim ?? 'none';
}

export function unitOf(f: FieldDef, values: FormValues, units: Units): string {
	if (inDegrees(f, values)) return '°';
	return f.dim ? UNIT_LABEL[f.dim][units] : (f.unit ?? '');
}

export const UNIT_LABEL: Record<Dimension, Record<Units, string>> = {
	length: { metric: 'mm', imperial: 'in' },
	elevation: { metric: 'm', imperial: 'ft' },
	temp: { metric: '°C', imperial: '°F' },
	pressure: { metric: 'hPa', imperial: 'inHg' },
	speed: { metric: 'km/h', imperial: 'mph' },
	volume: { metric: 'L', imperial: 'US gal' },
	none: { metric: '', imperial: '' }
};

const TO_IMPERIAL: Record<Dimension, (x: number) => number> = {
	length: t.mmToIn,
	elevation: t.mToFt,
	temp: t.cToF,
	pressure: (hPa) => t.kpaToInHg(hPa / 10),
	speed: t.kmhToMph,
	volume: t.lToGal,
	none: (x) => x
};
const TO_METRIC: Record<Dimension, (x: number) => number> = {
	length: t.inToMm,
	elevation: t.ftToM,
	temp: t.fToC,
	pressure: (inHg) => t.inHgToKpa(inHg) * 10,
	speed: t.mphToKmh,
	volume: t.galToL,
	none: (x) => x
};
const DECIMALS: Record<Dimension, Record<Units, number>> = {
	length: { metric: 2, imperial: 4 },
	elevation: { metric: 0, imperial: 0 },
	temp: { metric: 1, imperial: 1 },
	pressure: { metric: 1, imperial: 2 },
	speed: { metric: 1, imperial: 1 },
	volume: { metric: 2, imperial: 3 },
	none: { metric: 6, imperial: 6 }
};

/** Converts a typed value to the other unit system, keeping a sensible number of decimals. */
export function convertTyped(raw: string, dim: Dimension, to: Units): string {
	const v = Number(raw);
	if (raw.trim() === '' || !Number.isFinite(v) || dim === 'none') return raw;
	try {
		const x = (to === 'imperial' ? TO_IMPERIAL : TO_METRIC)[dim](v);
		return String(Number(x.toFixed(DECIMALS[dim][to])));
	} catch {
		return raw;
	}
}

export type FormValues = Record<string, string>;

/** The typed strings as the calculator's input: numbers, booleans, or absent when empty. */
export function toInput(
	fields: FieldDef[],
	values: FormValues,
	units: Units
): Record<string, unknown> {
	const out: Record<string, unknown> = { units };
	for (const f of fields) {
		const raw = (values[f.name] ?? '').trim();
		if (f.kind === 'checkbox') out[f.name] = raw === 'true';
		else if (raw === '') continue;
		else if (f.kind === 'number') out[f.name] = Number(raw.replace(',', '.'));
		else out[f.name] = raw;
	}
	return out;
}
