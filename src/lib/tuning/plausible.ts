// The ranges real small scooter engines reach, each with its reason. A value outside is still
// computed — a reader may have an odd engine — but the result carries a note to check it.
// Common practice, no published source. Every number is kept in SI and printed through the
// caller's `show`, so a note speaks the reader's units.

export type Range = {
	/** What this sheet accepts without a note. */
	min: number;
	max: number;
	/** Where real scooters usually sit. */
	typical: readonly [number, number];
	what: string;
	why: string;
	/** How a bare number of this kind is printed when the caller gives no `show`. */
	unit: string;
};

export const PLAUSIBLE = {
	boreMm: {
		min: 30,
		max: 75,
		typical: [38, 72],
		what: 'bore',
		why: 'scooter cylinders from 50 cc to the 250 cc class',
		unit: ' mm'
	},
	strokeMm: {
		min: 30,
		max: 70,
		typical: [37, 64],
		what: 'stroke',
		why: 'scooter cranks',
		unit: ' mm'
	},
	displacementCc: {
		min: 35,
		max: 300,
		typical: [49, 250],
		what: 'displacement',
		why: '50 cc scooters and their big-bore kits, up to the 250 cc class',
		unit: ' cc'
	},
	chamberCc: {
		min: 2,
		max: 30,
		typical: [4, 20],
		what: 'chamber volume',
		why: 'heads of 50–250 cc scooter engines',
		unit: ' cc'
	},
	compressionRatio: {
		min: 6,
		max: 16,
		typical: [9, 14],
		what: 'compression ratio',
		why: 'geometric ratios of road two-strokes',
		unit: ' : 1'
	},
	exhaustDurationDeg: {
		min: 140,
		max: 210,
		typical: [160, 200],
		what: 'exhaust duration',
		why: 'scooter exhaust ports',
		unit: '°'
	},
	transferDurationDeg: {
		min: 100,
		max: 145,
		typical: [115, 135],
		what: 'transfer duration',
		why: 'scooter transfer ports',
		unit: '°'
	},
	rpm: {
		min: 3000,
		max: 17000,
		typical: [6000, 14000],
		what: 'engine speed',
		why: 'where small two-strokes make their peak power',
		unit: ' rpm'
	},
	topCvtRatio: {
		min: 0.6,
		max: 1.3,
		typical: [0.75, 0.95],
		what: 'top CVT ratio',
		why: 'scooter variators fully shifted',
		unit: ' : 1'
	},
	launchCvtRatio: {
		min: 1.6,
		max: 3.6,
		typical: [2.2, 3.2],
		what: 'launch CVT ratio',
		why: 'scooter variators at rest',
		unit: ' : 1'
	},
	finalDriveRatio: {
		min: 5,
		max: 20,
		typical: [8, 15],
		what: 'final drive ratio',
		why: 'scooter gearboxes',
		unit: ' : 1'
	},
	speedKmh: {
		min: 10,
		max: 180,
		typical: [45, 120],
		what: 'speed',
		why: 'tuned 50–70 cc scooters',
		unit: ' km/h'
	},
	carbBoreMm: {
		min: 10,
		max: 36,
		typical: [12, 28],
		what: 'carburettor bore',
		why: 'scooter carburettors',
		unit: ' mm'
	},
	squishMm: {
		min: 0.4,
		max: 2.5,
		typical: [0.6, 1.6],
		what: 'squish clearance',
		why: 'scooter squish bands',
		unit: ' mm'
	},
	pulleyDiaMm: {
		min: 30,
		max: 200,
		typical: [40, 160],
		what: 'pulley pitch diameter',
		why: 'where scooter pulleys run the belt',
		unit: ' mm'
	},
	pipeLengthMm: {
		min: 400,
		max: 1500,
		typical: [600, 1100],
		what: 'tuned length',
		why: 'scooter expansion chambers',
		unit: ' mm'
	}
} as const satisfies Record<string, Range>;

export type PlausibleKey = keyof typeof PLAUSIBLE;

/**
 * A note when a value lies outside what real scooters reach, else undefined. `show` prints a
 * value of this kind in the reader's units; without it, the range's own unit is used.
 */
export function plausibilityNote(
	key: PlausibleKey,
	value: number,
	show?: (si: number) => string
): string | undefined {
	const r: Range = PLAUSIBLE[key];
	if (!Number.isFinite(value) || (value >= r.min && value <= r.max)) return undefined;
	const print =
		show ?? ((x: number) => `${x.toLocaleString('en-GB', { maximumFractionDigits: 2 })}${r.unit}`);
	const side = value < r.min ? 'low' : 'high';
	return `A ${r.what} this ${side} is unusual — check the value (${r.why}: usually ${print(r.typical[0])}–${print(r.typical[1])}; this sheet expects ${print(r.min)}–${print(r.max)}).`;
}
