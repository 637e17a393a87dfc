// The demo's catalogue of base scooters: invented makers and engines, two-stroke and four-stroke,
// 50 cc to 150 cc. Each scooter's factory numbers are chosen here; its stock top speed is computed
// from them (the stock gearing at the power peak, less drag, and a restricted one held to its
// class limit), so the catalogue agrees with the runs the demo builds then log.
import { gearingLimitedSpeedKmh } from '../../src/lib/tuning';
import { models } from '../../src/lib/server/db/models';
import type { EngineFamilyView } from '../../src/lib/scooters/catalogue';

type Family = Omit<EngineFamilyView, 'id' | 'displacementCc'>;

export const FAMILIES = {
	kestrel: {
		name: 'Kestrel 1E40 air, horizontal',
		engineCycle: 'two-stroke',
		cooling: 'air',
		cylinderOrientation: 'horizontal',
		boreMm: 40,
		strokeMm: 39.2
	},
	corran: {
		name: 'Corran V40 air, vertical',
		engineCycle: 'two-stroke',
		cooling: 'air',
		cylinderOrientation: 'vertical',
		boreMm: 40,
		strokeMm: 39.2
	},
	pembry: {
		name: 'Pembry LC40 liquid',
		engineCycle: 'two-stroke',
		cooling: 'liquid',
		cylinderOrientation: 'horizontal',
		boreMm: 40,
		strokeMm: 39.2
	},
	arlo50: {
		name: 'Arlo 4V39 four-stroke',
		engineCycle: 'four-stroke',
		cooling: 'air',
		cylinderOrientation: 'horizontal',
		boreMm: 39,
		strokeMm: 41.4
	},
	arlo125: {
		name: 'Arlo 4V52 four-stroke',
		engineCycle: 'four-stroke',
		cooling: 'air',
		cylinderOrientation: 'horizontal',
		boreMm: 52.4,
		strokeMm: 57.8
	},
	arlo150: {
		name: 'Arlo 4V57 four-stroke',
		engineCycle: 'four-stroke',
		cooling: 'air',
		cylinderOrientation: 'horizontal',
		boreMm: 57.4,
		strokeMm: 57.8
	}
} satisfies Record<string, Family>;

export type DemoScooter = {
	maker: string;
	model: string;
	yearFrom: number;
	yearTo: number | null;
	family: keyof typeof FAMILIES;
	carbBoreMm: number;
	stages: [number, number][];
	cvtLowRatio: number;
	cvtTopRatio: number;
	rollerCount: number;
	rollerWeightG: number;
	rearTyre: string;
	restrictors: string;
	peakRpm: number;
	/** The licence class's limit the factory restricts to, if any (km/h). */
	classLimitKmh: number | null;
};

const WASHER = 'exhaust manifold washer, variator spacer';
// The six the demo's two-stroke builds start from, then four-strokes and two more two-strokes.
export const SCOOTERS: DemoScooter[] = [
	{
		maker: 'Tessly',
		model: 'Urbano 50',
		yearFrom: 2014,
		yearTo: 2020,
		family: 'kestrel',
		carbBoreMm: 12,
		stages: [
			[13, 42],
			[13, 46]
		],
		cvtLowRatio: 2.6,
		cvtTopRatio: 0.97,
		rollerCount: 6,
		rollerWeightG: 6,
		rearTyre: '120/70-12 51L',
		restrictors: WASHER,
		peakRpm: 7000,
		classLimitKmh: 45
	},
	{
		maker: 'Kobrin',
		model: 'Metro 50',
		yearFrom: 2006,
		yearTo: 2013,
		family: 'kestrel',
		carbBoreMm: 12,
		stages: [
			[13, 43],
			[13, 47]
		],
		cvtLowRatio: 2.6,
		cvtTopRatio: 0.96,
		rollerCount: 6,
		rollerWeightG: 5.5,
		rearTyre: '3.50-10 51J',
		restrictors: WASHER,
		peakRpm: 7100,
		classLimitKmh: 45
	},
	{
		maker: 'Vallance',
		model: 'Sprint 50 LC',
		yearFrom: 2019,
		yearTo: null,
		family: 'pembry',
		carbBoreMm: 12,
		stages: [
			[13, 42],
			[13, 46]
		],
		cvtLowRatio: 2.55,
		cvtTopRatio: 0.95,
		rollerCount: 6,
		rollerWeightG: 6.5,
		rearTyre: '130/60-13 53P',
		restrictors: 'CDI rev limit, variator spacer',
		peakRpm: 7300,
		classLimitKmh: 45
	},
	{
		maker: 'Ostrey',
		model: 'Piazza 50',
		yearFrom: 2012,
		yearTo: 2019,
		family: 'corran',
		carbBoreMm: 12,
		stages: [
			[13, 42],
			[13, 47]
		],
		cvtLowRatio: 2.6,
		cvtTopRatio: 0.98,
		rollerCount: 6,
		rollerWeightG: 6,
		rearTyre: '120/70-12 51L',
		restrictors: WASHER,
		peakRpm: 6900,
		classLimitKmh: 45
	},
	{
		maker: 'Marrowby',
		model: 'Dash 50',
		yearFrom: 2004,
		yearTo: 2011,
		family: 'corran',
		carbBoreMm: 12,
		stages: [
			[13, 43],
			[13, 46]
		],
		cvtLowRatio: 2.65,
		cvtTopRatio: 0.97,
		rollerCount: 6,
		rollerWeightG: 5.5,
		rearTyre: '120/90-10 57J',
		restrictors: WASHER,
		peakRpm: 7000,
		classLimitKmh: 45
	},
	{
		maker: 'Quennel',
		model: 'Strada 50 LC',
		yearFrom: 2021,
		yearTo: null,
		family: 'pembry',
		carbBoreMm: 12,
		stages: [
			[13, 42],
			[13, 46]
		],
		cvtLowRatio: 2.55,
		cvtTopRatio: 0.95,
		rollerCount: 6,
		rollerWeightG: 6.5,
		rearTyre: '120/70-13 53P',
		restrictors: 'CDI rev limit, variator spacer',
		peakRpm: 7400,
		classLimitKmh: 45
	},
	{
		maker: 'Harrow',
		model: 'Vesta 50',
		yearFrom: 2017,
		yearTo: 2022,
		family: 'kestrel',
		carbBoreMm: 12,
		stages: [
			[13, 42],
			[13, 46]
		],
		cvtLowRatio: 2.6,
		cvtTopRatio: 0.96,
		rollerCount: 6,
		rollerWeightG: 6,
		rearTyre: '120/70-12 51L',
		restrictors: WASHER,
		peakRpm: 7000,
		classLimitKmh: 45
	},
	{
		maker: 'Tessly',
		model: 'Urbano 50 4T',
		yearFrom: 2019,
		yearTo: null,
		family: 'arlo50',
		carbBoreMm: 16,
		stages: [
			[14, 45],
			[13, 44]
		],
		cvtLowRatio: 2.7,
		cvtTopRatio: 0.85,
		rollerCount: 6,
		rollerWeightG: 10,
		rearTyre: '120/70-12 51L',
		restrictors: 'throttle stop, CDI rev limit',
		peakRpm: 7500,
		classLimitKmh: 45
	},
	{
		maker: 'Marrowby',
		model: 'Dash 50 4T',
		yearFrom: 2012,
		yearTo: 2018,
		family: 'arlo50',
		carbBoreMm: 16,
		stages: [
			[14, 45],
			[13, 44]
		],
		cvtLowRatio: 2.7,
		cvtTopRatio: 0.85,
		rollerCount: 6,
		rollerWeightG: 10,
		rearTyre: '120/90-10 57J',
		restrictors: 'throttle stop, CDI rev limit',
		peakRpm: 7500,
		classLimitKmh: 45
	},
	{
		maker: 'Kobrin',
		model: 'Metro 125',
		yearFrom: 2014,
		yearTo: null,
		family: 'arlo125',
		carbBoreMm: 24,
		stages: [
			[15, 44],
			[13, 40]
		],
		cvtLowRatio: 2.5,
		cvtTopRatio: 0.82,
		rollerCount: 6,
		rollerWeightG: 15,
		rearTyre: '130/70-12 56L',
		restrictors: '',
		peakRpm: 7500,
		classLimitKmh: null
	},
	{
		maker: 'Ostrey',
		model: 'Piazza 125',
		yearFrom: 2016,
		yearTo: null,
		family: 'arlo125',
		carbBoreMm: 24,
		stages: [
			[15, 44],
			[13, 40]
		],
		cvtLowRatio: 2.5,
		cvtTopRatio: 0.82,
		rollerCount: 6,
		rollerWeightG: 15,
		rearTyre: '130/70-12 56L',
		restrictors: '',
		peakRpm: 7500,
		classLimitKmh: null
	},
	{
		maker: 'Vallance',
		model: 'Corsa 150',
		yearFrom: 2018,
		yearTo: null,
		family: 'arlo150',
		carbBoreMm: 26,
		stages: [
			[15, 42],
			[13, 40]
		],
		cvtLowRatio: 2.45,
		cvtTopRatio: 0.8,
		rollerCount: 6,
		rollerWeightG: 16,
		rearTyre: '130/60-13 53P',
		restrictors: '',
		peakRpm: 7500,
		classLimitKmh: null
	}
];

/** Drag and a not-quite-full shift take about this much off the gearing's limit (demo model). */
const DRAG_SHARE = 0.09;

/** The stock top speed the demo gives a scooter: its gearing limit less drag, held to its class. */
export function demoStockSpeedKmh(s: DemoScooter): number {
	const free = gearingLimitedSpeedKmh(s.peakRpm, s.cvtTopRatio, s.stages, s.rearTyre);
	const speed = free * (1 - DRAG_SHARE);
	return Math.round(Math.min(speed, s.classLimitKmh ?? Infinity) * 10) / 10;
}

export const demoScooterKey = (s: Pick<DemoScooter, 'maker' | 'model'>) => `${s.maker} ${s.model}`;

/** Adds what is missing of the catalogue; returns each scooter's id by "maker model". */
export async function seedScooters(): Promise<Map<string, number>> {
	const { EngineFamily, BaseScooter } = models();
	const familyIds = new Map<string, number>();
	for (const [key, f] of Object.entries(FAMILIES)) {
		const [row] = await EngineFamily.findOrCreate({ where: { name: f.name }, defaults: f });
		familyIds.set(key, row.id);
	}
	const ids = new Map<string, number>();
	for (const s of SCOOTERS) {
		const [row] = await BaseScooter.findOrCreate({
			where: { maker: s.maker, model: s.model, yearFrom: s.yearFrom },
			defaults: {
				maker: s.maker,
				model: s.model,
				yearFrom: s.yearFrom,
				yearTo: s.yearTo,
				engineFamilyId: familyIds.get(s.family)!,
				carbBoreMm: s.carbBoreMm,
				primaryDriver: s.stages[0][0],
				primaryDriven: s.stages[0][1],
				secondaryDriver: s.stages[1]?.[0] ?? null,
				secondaryDriven: s.stages[1]?.[1] ?? null,
				cvtLowRatio: s.cvtLowRatio,
				cvtTopRatio: s.cvtTopRatio,
				rollerCount: s.rollerCount,
				rollerWeightG: s.rollerWeightG,
				rearTyre: s.rearTyre,
				restrictors: s.restrictors,
				peakRpm: s.peakRpm,
				stockSpeedKmh: demoStockSpeedKmh(s),
				stockSpeedSource: s.classLimitKmh
					? `restricted to the ${s.classLimitKmh} km/h class (demo catalogue)`
					: 'stock gearing at the power peak, less drag (demo catalogue)',
				state: 'listed'
			}
		});
		ids.set(demoScooterKey(s), row.id);
	}
	return ids;
}
