// Tyre sizes and speed symbols.
import { between, finite } from './check';

/** ISO 4000-1 / ETRTO speed symbols, km/h (the moped end first). */
export const SPEED_SYMBOLS: Readonly<Record<string, number>> = {
	B: 50,
	C: 60,
	D: 65,
	E: 70,
	F: 80,
	G: 90,
	J: 100,
	K: 110,
	L: 120,
	M: 130,
	N: 140,
	P: 150,
	Q: 160,
	R: 170,
	S: 180,
	T: 190,
	U: 200,
	H: 210,
	V: 240,
	W: 270,
	Y: 300
};

export function speedSymbolKmh(letter: string): number {
	const key = typeof letter === 'string' ? letter.trim().toUpperCase() : '';
	const v = SPEED_SYMBOLS[key];
	if (v === undefined)
		throw new RangeError(
			`letter must be an ISO 4000-1 speed symbol from B to Y (got ${String(letter)})`
		);
	return v;
}

/**
 * ISO 4000-1 / ETRTO load index → the most a tyre may carry, kg, for the indexes small wheels
 * carry (from memory of the published table; 53 → 206 kg is checked in the tests).
 */
export const LOAD_INDEX_KG: Readonly<Record<number, number>> = {
	30: 106,
	31: 109,
	32: 112,
	33: 115,
	34: 118,
	35: 121,
	36: 125,
	37: 128,
	38: 132,
	39: 136,
	40: 140,
	41: 145,
	42: 150,
	43: 155,
	44: 160,
	45: 165,
	46: 170,
	47: 175,
	48: 180,
	49: 185,
	50: 190,
	51: 195,
	52: 200,
	53: 206,
	54: 212,
	55: 218,
	56: 224,
	57: 230,
	58: 236,
	59: 243,
	60: 250,
	61: 257,
	62: 265,
	63: 272,
	64: 280,
	65: 290,
	66: 300,
	67: 307,
	68: 315,
	69: 325,
	70: 335,
	71: 345,
	72: 355,
	73: 365,
	74: 375,
	75: 387
};

export type TyreConstruction = 'radial' | 'bias-belted' | 'diagonal';

export type Tyre = {
	widthMm: number;
	aspectPct: number;
	rimIn: number;
	construction?: TyreConstruction;
	speedSymbol?: string;
	loadIndex?: number;
	/** TL (tubeless) or TT (tube type), when marked. */
	tubeless?: boolean;
	/** REINF / RF / "reinforced": a reinforced carcass with a higher load for its index. */
	reinforced?: boolean;
	/** Inch sizes (3.50-10) carry no aspect ratio: 100 % is assumed, an approximation. */
	approximate?: boolean;
};

// The size at the start of the marking: 120/70-12 · 120/70 R12 · 120/70ZR12 · 130/60 B 13
const METRIC = /^(\d{2,3})\s*\/\s*(\d{2,3})\s*(ZR|R|B|D|-)?\s*(\d{1,2}(?:\.\d)?)(?=\s|$|\()/;
// 3.50-10 · 3.50 x 10 · 3.00 - 10
const INCH = /^(\d{1,2}(?:\.\d{1,2})?)\s*(?:-|X|\s)\s*(\d{1,2})(?=\s|$|\()/;
const CONSTRUCTION: Record<string, TyreConstruction> = {
	R: 'radial',
	ZR: 'radial',
	B: 'bias-belted',
	D: 'diagonal',
	'-': 'diagonal'
};

/**
 * Reads a scooter tyre's sidewall marking as ISO 5751 / ETRTO write it: the size (metric
 * width/aspect, construction, rim; or the inch width-rim form), then in any order "M/C", the
 * service description (load index and speed symbol, e.g. 51L, also in brackets), TL or TT, and
 * REINF / RF. A word it cannot place is refused, never skipped.
 */
export function parseTyre(designation: string): Tyre {
	const d = typeof designation === 'string' ? designation.trim() : '';
	const up = d.toUpperCase();
	let t: Tyre;
	let rest: string;
	let m = METRIC.exec(up);
	if (m) {
		t = { widthMm: Number(m[1]), aspectPct: Number(m[2]), rimIn: Number(m[4]) };
		t.construction = CONSTRUCTION[m[3] ?? '-'];
		rest = up.slice(m[0].length);
	} else if ((m = INCH.exec(up))) {
		t = { widthMm: Number(m[1]) * 25.4, aspectPct: 100, rimIn: Number(m[2]), approximate: true };
		rest = up.slice(m[0].length);
	} else
		throw new RangeError(
			`designation is not a tyre size we can read: "${String(designation)}" (try 130/60-13 or 3.50-10)`
		);
	for (const word of rest.replace(/[()]/g, ' ').split(/\s+/).filter(Boolean)) {
		const service = /^(\d{2,3})([A-Z])$/.exec(word);
		if (service && t.loadIndex === undefined) {
			t.loadIndex = Number(service[1]);
			t.speedSymbol = symbolOrThrow(service[2], d);
		} else if (word === 'TL' || word === 'TT') t.tubeless = word === 'TL';
		else if (word === 'REINF' || word === 'RF' || word === 'REINFORCED') t.reinforced = true;
		else if (word === 'M/C' || word === 'MC') continue;
		else throw new RangeError(`designation has a marking we do not read: "${word}" (${d})`);
	}
	return sane(t, d);
}

/** The load a load index allows, kg, or undefined outside the table this module carries. */
export const loadIndexKg = (index: number): number | undefined => LOAD_INDEX_KG[index];

function symbolOrThrow(raw: string, designation: string): string {
	if (SPEED_SYMBOLS[raw] === undefined)
		throw new RangeError(`designation has an unknown speed symbol "${raw}" (${designation})`);
	return raw;
}

function sane(t: Tyre, d: string): Tyre {
	if (
		t.widthMm < 40 ||
		t.widthMm > 400 ||
		t.aspectPct < 20 ||
		t.aspectPct > 110 ||
		t.rimIn < 6 ||
		t.rimIn > 23
	) {
		throw new RangeError(`designation gives an implausible tyre (${d})`);
	}
	return t;
}

/** Unloaded diameter D = 25.4 · rim + 2 · W · AR/100 (mm), the ETRTO / ISO 5751 sizing convention. */
export function tyreDiameterMm(designation: string): number {
	const t = parseTyre(designation);
	return 25.4 * t.rimIn + (2 * t.widthMm * t.aspectPct) / 100;
}

/**
 * Rolling circumference π · D · factor. The loaded, rolling tyre is a few per cent smaller
 * than the unloaded one; the factor (default 1) lets people enter what they measured.
 */
export function tyreCircumferenceMm(designation: string, rollingFactor = 1): number {
	finite('rollingFactor', rollingFactor);
	between('rollingFactor', rollingFactor, 0.8, 1.1);
	return Math.PI * tyreDiameterMm(designation) * rollingFactor;
}
