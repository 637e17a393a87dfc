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

export type Tyre = {
	widthMm: number;
	aspectPct: number;
	rimIn: number;
	speedSymbol?: string;
	loadIndex?: number;
	/** Inch sizes (3.50-10) carry no aspect ratio: 100 % is assumed, an approximation. */
	approximate?: boolean;
};

// 130/60-13 53P · 120/70R12 · 120/70 ZR 12 M/C 51L TL
const METRIC =
	/^(\d{2,3})\s*\/\s*(\d{2,3})\s*(?:-|Z?R|B|D|\s)\s*(\d{1,2}(?:\.\d)?)\s*(?:M\/C\s*)?(?:(\d{2,3})\s*([A-Z]))?\s*(?:TL|TT)?$/i;
// 3.50-10 51J · 3.00 - 10
const INCH = /^(\d{1,2}(?:\.\d{1,2})?)\s*-\s*(\d{1,2})\s*(?:(\d{2,3})\s*([A-Z]))?\s*(?:TL|TT)?$/i;

function symbolOrThrow(raw: string | undefined, designation: string) {
	if (!raw) return undefined;
	const s = raw.toUpperCase();
	if (SPEED_SYMBOLS[s] === undefined)
		throw new RangeError(`designation has an unknown speed symbol "${s}" (${designation})`);
	return s;
}

/** Reads a metric (W/AR-rim) or inch (W-rim) scooter tyre size, per the ETRTO / ISO 5751 convention. */
export function parseTyre(designation: string): Tyre {
	const d = typeof designation === 'string' ? designation.trim() : '';
	let m = METRIC.exec(d);
	if (m) {
		const t: Tyre = { widthMm: Number(m[1]), aspectPct: Number(m[2]), rimIn: Number(m[3]) };
		if (m[4]) t.loadIndex = Number(m[4]);
		const s = symbolOrThrow(m[5], d);
		if (s) t.speedSymbol = s;
		return sane(t, d);
	}
	m = INCH.exec(d);
	if (m) {
		const t: Tyre = {
			widthMm: Number(m[1]) * 25.4,
			aspectPct: 100,
			rimIn: Number(m[2]),
			approximate: true
		};
		if (m[3]) t.loadIndex = Number(m[3]);
		const s = symbolOrThrow(m[4], d);
		if (s) t.speedSymbol = s;
		return sane(t, d);
	}
	throw new RangeError(
		`designation is not a tyre size we can read: "${String(designation)}" (try 130/60-13 or 3.50-10)`
	);
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
