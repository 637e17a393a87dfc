// Sixty invented build sheets: stock 50 cc scooters through 70 cc kits with expansion chambers,
// tuned at sea level up to 2,000 m in every season. Fixed seed, so every start makes the same set.
import { gearingLimitedSpeedKmh } from '../../src/lib/tuning';
import * as builds from '../../src/lib/server/sheet/builds';
import { models } from '../../src/lib/server/db/models';
import { addPart, saveRun, saveSetup } from '../../src/lib/server/sheet/service';
import { setPublication } from '../../src/lib/server/sheet/build-service';
import { FAMILIES, SCOOTERS, demoScooterKey, type DemoScooter } from './scooters';

function mulberry32(seed: number) {
	return () => {
		seed |= 0;
		seed = (seed + 0x6d2b79f5) | 0;
		let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
		t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
}
const rnd = mulberry32(20261201);
// Each build draws from its own stream, seeded from the main one, so skipping an existing build
// (a second seed) leaves every other build exactly as a first seed makes it.
let rng = rnd;
const pick = <T>(xs: readonly T[]) => xs[Math.floor(rng() * xs.length)];
const between = (a: number, b: number) => a + (b - a) * rng();
const round = (x: number, step: number) => Math.round(x / step) * step;

// Each chassis as owners write it, and the base scooter it is (the first six of the catalogue).
const CHASSIS = [
	'Tessly Urbano 12-inch (2018)',
	'Kobrin Metro 10-inch (2011)',
	'Vallance Sprint 13-inch (2020)',
	'Ostrey Piazza 12-inch (2015)',
	'Marrowby Dash 10-inch (2008)',
	'Quennel Strada 13-inch (2022)'
];
const PLACES = [
	{ name: 'the harbour', elevation: 10 },
	{ name: 'the river valley', elevation: 150 },
	{ name: 'the low hills', elevation: 450 },
	{ name: 'the plateau', elevation: 900 },
	{ name: 'the high town', elevation: 1400 },
	{ name: 'the pass road garage', elevation: 2000 }
];
const SEASONS = [
	{ month: '01', temp: [-2, 6], rh: [70, 90] },
	{ month: '04', temp: [8, 16], rh: [55, 75] },
	{ month: '07', temp: [22, 33], rh: [35, 60] },
	{ month: '10', temp: [8, 15], rh: [60, 85] }
];
const KITS = [
	'Brannoch 70 cc cast-iron kit',
	'Ferrow 70 cc plated-aluminium kit',
	'Ostley 68 cc sport cylinder'
];
const PIPES = ['Halvard expansion chamber', 'Gresley chamber pipe', 'Tamm sport expansion'];

export type Config = Record<string, string | number | boolean | null>;

/** What the gearing allows at the setup's peak rpm: no demo run is ever faster. */
export function gearingLimitOf(c: Config) {
	return gearingLimitedSpeedKmh(
		c.peakRpm as number,
		c.topCvtRatio as number,
		[
			[c.primaryDriver as number, c.primaryDriven as number],
			[c.secondaryDriver as number, c.secondaryDriven as number]
		],
		c.rearTyre as string
	);
}

/** The stock baseline as the scooter left the factory; the jet and squish as each engine came. */
function stockSetup(sc: DemoScooter): Config {
	const f = FAMILIES[sc.family];
	return {
		changeNote: 'Stock baseline',
		isStock: true,
		bore: f.boreMm,
		stroke: f.strokeMm,
		kitMaterial: 'cast-iron',
		squish: round(between(1.2, 1.6), 0.05),
		carbBore: sc.carbBoreMm,
		mainJet: round(between(76, 84), 2),
		jetNumbering: 'diameter',
		needleClip: 3,
		airScrewTurns: 1.5,
		exhaustType: 'stock',
		restrictorRemoved: false,
		rollerWeights: `${sc.rollerCount}x${sc.rollerWeightG}`,
		topCvtRatio: sc.cvtTopRatio,
		primaryDriver: sc.stages[0][0],
		primaryDriven: sc.stages[0][1],
		secondaryDriver: sc.stages[1][0],
		secondaryDriven: sc.stages[1][1],
		rearTyre: sc.rearTyre,
		lubrication: 'oil-injection',
		octane: 95,
		peakRpm: sc.peakRpm + round(between(-200, 200), 100),
		casePorted: false
	};
}

/** A speed held near the class limit while the factory restrictors are in. */
function restricted(c: Config, sc: DemoScooter, speed: number): number {
	if (c.restrictorRemoved || !sc.classLimitKmh) return speed;
	return Math.min(speed, sc.classLimitKmh * (0.97 + 0.05 * rng()));
}

const STEPS: ((c: Config) => [string, Config, [string, string, number][]])[] = [
	(c) => [
		'Sport silencer, restrictor out, jet up',
		{
			...c,
			exhaustType: 'sport',
			restrictorRemoved: true,
			mainJet: (c.mainJet as number) + 4,
			peakRpm: (c.peakRpm as number) + 700
		},
		[['exhaust', 'Pell sport silencer', between(70, 110)]]
	],
	(c) => {
		const carb = pick([17, 19]);
		return [
			`70 cc kit and ${carb} mm carburettor`,
			{
				...c,
				bore: 47,
				kitMaterial: pick(['cast-iron', 'plated-aluminium']),
				squish: round(between(0.7, 1.0), 0.05),
				carbBore: carb,
				mainJet: round(between(88, 98), 2),
				lubrication: 'premix',
				premixRatio: 50,
				peakRpm: round(between(8800, 9600), 100),
				topCvtRatio: 0.9
			},
			[
				['cylinder', pick(KITS), between(140, 230)],
				['carburettor', `Dunmore ${carb} mm carburettor and jets`, between(60, 120)]
			]
		];
	},
	(c) => [
		'Expansion chamber, jetted richer',
		{
			...c,
			exhaustType: 'expansion-chamber',
			mainJet: (c.mainJet as number) + 4,
			peakRpm: round(between(10000, 10800), 100),
			casePorted: true,
			casePortingNote: 'transfers matched to the kit'
		},
		[['exhaust', pick(PIPES), between(110, 260)]]
	],
	(c) => [
		'Taller final drive and sport variator',
		{
			...c,
			primaryDriver: 15,
			topCvtRatio: round(between(0.8, 0.84), 0.01),
			variatorType: 'Corrin sport variator'
		},
		[
			['final-drive', 'Wexcombe 15/43 primary gears', between(60, 110)],
			['cvt', 'Corrin sport variator', between(45, 90)]
		]
	],
	(c) => [
		'Lighter rollers for the power band',
		{ ...c, rollerWeights: '3x5.0 + 3x4.5', clutchEngageRpm: 5200 },
		[['cvt', 'Brisk 5.0/4.5 g roller set', between(12, 20)]]
	]
];

export async function seedBuilds(
	ownerIds: string[],
	scooterIds: Map<string, number>
): Promise<number> {
	let added = 0;
	for (let i = 0; i < 60; i++) {
		const chassis = CHASSIS[i % CHASSIS.length];
		const scooter = SCOOTERS[i % CHASSIS.length];
		const family = FAMILIES[scooter.family];
		const place = PLACES[(i * 7) % PLACES.length];
		const steps = 1 + (i % 5);
		const title = `${chassis.split(' ').slice(0, 2).join(' ')} no. ${i + 1}: ${steps === 1 ? 'stock and measured' : steps < 3 ? 'first steps' : steps < 4 ? '70 cc kit' : '70 cc kit with expansion chamber'}`;
		const local = mulberry32(Math.floor(rnd() * 1e9));
		if (await models().Build.findOne({ where: { title } })) continue;
		rng = local;
		const b = await builds.create(ownerIds[i % ownerIds.length], {
			title,
			chassis,
			engineFamily: family.name,
			cylinderOrientation: family.cylinderOrientation,
			cooling: family.cooling,
			brakeFront: pick(['190 mm disc', '220 mm disc', '110 mm drum']),
			brakeRear: '110 mm drum',
			brakesUpgraded: steps >= 4 && i % 2 === 0,
			currency: pick(['EUR', 'EUR', 'GBP', 'USD']),
			story: `Tuned at ${place.name} (about ${place.elevation} m). Every change was made one at a time and measured with a GPS logger on a closed course.`
		});
		await models().Build.update(
			{ baseScooterId: scooterIds.get(demoScooterKey(scooter)) ?? null },
			{ where: { id: b.id } }
		);
		let config = stockSetup(scooter);
		for (let s = 0; s < steps; s++) {
			let parts: [string, string, number][] = [];
			let note = 'Stock baseline';
			if (s > 0) [note, config, parts] = STEPS[s - 1]({ ...config, isStock: false });
			const { id: setupId } = (await saveSetup(b.id, { ...config, changeNote: note })) as {
				id: number;
			};
			for (const [category, name, cost] of parts)
				await addPart(b.id, {
					category,
					name,
					cost: Math.round(cost * 100) / 100,
					link: null,
					setupId
				});
			const limit = gearingLimitOf(config);
			const runsHere = 1 + Math.floor(local() * 2);
			for (let r = 0; r < runsHere; r++) {
				const season = SEASONS[Math.floor(local() * SEASONS.length)];
				await saveRun(b.id, setupId, {
					runOn: `${2024 + Math.floor(s / 2)}-${season.month}-${String(10 + r * 7 + s).padStart(2, '0')}`,
					// At or below the gearing limit: drag and a not-quite-full shift cost 3–15 %; with
					// its restrictors in, about the class limit the factory set.
					speed: Math.round(restricted(config, scooter, limit * (0.85 + 0.12 * local())) * 10) / 10,
					method: pick(['gps-logger', 'gps-logger', 'phone-gps', 'radar']),
					twoWay: local() < 0.6,
					venue: local() < 0.7 ? 'closed-course' : 'private-ground',
					elevation: place.elevation,
					temp: Math.round(between(season.temp[0], season.temp[1])),
					humidity: Math.round(between(season.rh[0], season.rh[1])),
					pressure: null,
					pressureKind: 'sea-level',
					chtFull: Math.round(between(170, 225)),
					chtSensor: 'plug-washer',
					riderMass: Math.round(between(65, 95)),
					plugReading: pick(['tan', 'tan', 'brown', 'light-grey']),
					breakIn: s > 1 && r === 0,
					notes: ''
				});
			}
		}
		if (i % 7 !== 6) {
			const fresh = await builds.read(b.id);
			if (fresh) await setPublication(fresh, 'published');
		}
		added++;
	}
	return added;
}
