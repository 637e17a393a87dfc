// The ranges real small scooter engines reach, each with its reason. A value outside is still
// computed — a reader may have an odd engine — but the result carries a note to check it.
// Common practice, no published source, unless a line says otherwise.

export type Range = { min: number; max: number; what: string; why: string };

export const PLAUSIBLE = {
	boreMm: {
		min: 30,
		max: 75,
		what: 'bore',
		why: 'scooter cylinders from 50 to about 250 cc run bores of about 38–72 mm'
	},
	strokeMm: {
		min: 30,
		max: 70,
		what: 'stroke',
		why: 'scooter cranks run strokes of about 37–64 mm'
	},
	rodToStroke: {
		min: 1.4,
		max: 3,
		what: 'con-rod to stroke ratio',
		why: 'small two-strokes run rods of about 1.6–2.4 strokes'
	},
	displacementCc: {
		min: 35,
		max: 300,
		what: 'displacement',
		why: 'the site is about 50 cc scooters and their big-bore kits, up to the 250 cc class'
	},
	chamberCc: {
		min: 2,
		max: 30,
		what: 'chamber volume',
		why: 'heads of 50–250 cc scooter engines hold about 4–20 cc'
	},
	compressionRatio: {
		min: 6,
		max: 16,
		what: 'compression ratio',
		why: 'geometric ratios of road two-strokes lie around 9–14 : 1'
	},
	exhaustDurationDeg: {
		min: 140,
		max: 210,
		what: 'exhaust duration',
		why: 'scooter exhaust ports stay open about 160–200°'
	},
	transferDurationDeg: {
		min: 100,
		max: 145,
		what: 'transfer duration',
		why: 'scooter transfers stay open about 115–135°'
	},
	rpm: {
		min: 3000,
		max: 17000,
		what: 'engine speed',
		why: 'small two-strokes peak between about 6,000 and 14,000 rpm'
	},
	topCvtRatio: {
		min: 0.6,
		max: 1.3,
		what: 'top CVT ratio',
		why: 'scooter variators shift down to about 0.75–0.95 : 1'
	},
	launchCvtRatio: {
		min: 1.6,
		max: 3.6,
		what: 'launch CVT ratio',
		why: 'scooter variators start at about 2.2–3.2 : 1'
	},
	finalDriveRatio: {
		min: 5,
		max: 20,
		what: 'final drive ratio',
		why: 'scooter gearboxes reduce about 8–15 : 1'
	},
	speedKmh: {
		min: 10,
		max: 180,
		what: 'speed',
		why: 'tuned 50–70 cc scooters reach about 45–120 km/h'
	},
	carbBoreMm: {
		min: 10,
		max: 36,
		what: 'carburettor bore',
		why: 'scooter carburettors run from about 12 to 28 mm'
	},
	squishMm: {
		min: 0.4,
		max: 2.5,
		what: 'squish clearance',
		why: 'scooter squish bands are set about 0.6–1.6 mm'
	},
	pulleyDiaMm: {
		min: 30,
		max: 200,
		what: 'pulley pitch diameter',
		why: 'scooter pulleys run the belt on about 40–160 mm'
	},
	pipeLengthMm: {
		min: 400,
		max: 1500,
		what: 'tuned length',
		why: 'scooter expansion chambers are about 600–1,100 mm long'
	}
} as const satisfies Record<string, Range>;

export type PlausibleKey = keyof typeof PLAUSIBLE;

/**
 * A note when a value lies outside what real scooters reach, else undefined. `show` prints a
 * value of this kind in the reader's units (the range is given in SI and shown through it).
 */
export function plausibilityNote(
	key: PlausibleKey,
	value: number,
	show: (si: number) => string = (x) => String(x)
): string | undefined {
	const r: Range = PLAUSIBLE[key];
	if (!Number.isFinite(value) || (value >= r.min && value <= r.max)) return undefined;
	const side = value < r.min ? 'low' : 'high';
	return `A ${r.what} this ${side} is unusual — check the value (${r.why}; this sheet expects ${show(r.min)}–${show(r.max)}).`;
}
