// Twenty-four invented "one change at a time" sheets: a 70 cc kit with an expansion chamber, then a
// run of single changes (final drive, jet, needle clip, rollers, tyre, variator, pipe, springs), each
// measured the same day with the same method — the material change effects is made of. A few steps
// break the rules on purpose (a radar run after a GPS one, a summer run after a winter one) so the
// page has excluded pairs to explain. Fixed seed, like the other demo sheets.
import * as builds from '../../src/lib/server/sheet/builds';
import { models } from '../../src/lib/server/db/models';
import { addPart, saveRun, saveSetup } from '../../src/lib/server/sheet/service';
import { setPublication } from '../../src/lib/server/sheet/build-service';
import { gearingLimitOf, type Config } from './builds';
import { FAMILIES } from './scooters';

type Step = {
	note: string;
	change: (c: Config) => Config;
	part: [string, string, number];
	gain: [number, number];
};

function mulberry32(seed: number) {
	return () => {
		seed = (seed + 0x6d2b79f5) | 0;
		let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
		t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
}

const STEPS: Step[] = [
	{
		note: 'One tooth taller on the primary gears',
		change: (c) => ({ ...c, primaryDriver: (c.primaryDriver as number) + 1 }),
		part: ['final-drive', 'Wexcombe primary gear pair, one tooth up', 70],
		gain: [2, 5]
	},
	{
		note: 'Main jet two sizes up',
		change: (c) => ({ ...c, mainJet: (c.mainJet as number) + 2 }),
		part: ['carburettor', 'Dunmore main jet', 4],
		gain: [-1, 2]
	},
	{
		note: 'Needle clip one notch richer',
		change: (c) => ({ ...c, needleClip: (c.needleClip as number) + 1 }),
		part: ['carburettor', 'Dunmore needle clip', 1],
		gain: [-1, 1.5]
	},
	{
		note: 'Rollers half a gram lighter',
		change: (c) => ({ ...c, rollerWeights: '6x4.5' }),
		part: ['cvt', 'Brisk 4.5 g roller set', 15],
		gain: [-1.5, 1]
	},
	{
		note: 'Taller rear tyre',
		change: (c) => ({ ...c, rearTyre: '130/70-12 56L' }),
		part: ['tyres', 'Pellard 130/70-12 road tyre', 55],
		gain: [0.5, 2.5]
	},
	{
		note: 'Sport variator',
		change: (c) => ({ ...c, variatorType: 'Corrin sport variator', topCvtRatio: 0.82 }),
		part: ['cvt', 'Corrin sport variator', 65],
		gain: [1, 4]
	},
	{
		note: 'Chamber with a higher power band',
		change: (c) => ({ ...c, powerBandFrom: 8400, powerBandTo: 11500 }),
		part: ['exhaust', 'Gresley high-band chamber', 180],
		gain: [1, 4]
	},
	{
		note: 'Stiffer torque spring',
		change: (c) => ({ ...c, torqueSpring: 'Corrin red, +15 %' }),
		part: ['cvt', 'Corrin red torque spring', 18],
		gain: [-0.5, 0.5]
	}
];

export async function seedOneChange(
	ownerIds: string[],
	scooterIds: Map<string, number>
): Promise<number> {
	const rnd = mulberry32(20261202);
	let added = 0;
	for (let i = 0; i < 24; i++) {
		const rng = mulberry32(Math.floor(rnd() * 1e9));
		const between = (a: number, b: number) => a + (b - a) * rng();
		const title = `Harrow Vesta 12-inch no. ${i + 1}: one change at a time`;
		if (await models().Build.findOne({ where: { title } })) continue;
		const elevation = [20, 300, 800, 1500][i % 4];
		const b = await builds.create(ownerIds[(i * 5) % ownerIds.length], {
			title,
			chassis: 'Harrow Vesta 12-inch (2019)',
			engineFamily: FAMILIES.kestrel.name,
			cylinderOrientation: 'horizontal',
			cooling: 'air',
			brakeFront: '220 mm disc',
			brakeRear: '110 mm drum',
			brakesUpgraded: true,
			currency: i % 3 === 0 ? 'GBP' : 'EUR',
			story: `Built as a 70 cc kit with an expansion chamber, then changed one thing at a time. Every run on the same stretch of closed course at about ${elevation} m, two ways, on a GPS logger.`
		});
		await models().Build.update(
			{ baseScooterId: scooterIds.get('Harrow Vesta 50') ?? null },
			{ where: { id: b.id } }
		);
		let config: Config = {
			changeNote: 'Kit, chamber and 19 mm carburettor run in',
			isStock: false,
			bore: 47,
			stroke: 39.2,
			kitMaterial: 'cast-iron',
			squish: 0.8,
			carbBore: 19,
			mainJet: 96,
			jetNumbering: 'diameter',
			needleClip: 2,
			airScrewTurns: 1.5,
			exhaustType: 'expansion-chamber',
			powerBandFrom: 7800,
			powerBandTo: 10800,
			restrictorRemoved: true,
			rollerWeights: '6x5',
			topCvtRatio: 0.86,
			primaryDriver: 13,
			primaryDriven: 43,
			secondaryDriver: 13,
			secondaryDriven: 47,
			rearTyre: '120/70-12 51L',
			lubrication: 'premix',
			premixRatio: 50,
			octane: 98,
			peakRpm: 10200,
			casePorted: true
		};
		// Each sheet takes three to five of the steps, starting at a different one.
		const steps = [config, ...Array.from({ length: 3 + (i % 3) })];
		let speed = 0;
		for (let s = 0; s < steps.length; s++) {
			const step = s === 0 ? null : STEPS[(i + s - 1) % STEPS.length];
			if (step) config = { ...step.change(config), changeNote: step.note };
			const { id: setupId } = (await saveSetup(b.id, config)) as { id: number };
			if (step)
				await addPart(b.id, {
					category: step.part[0],
					name: step.part[1],
					cost: step.part[2],
					link: null,
					setupId
				});
			const limit = gearingLimitOf(config);
			speed = step ? speed + between(...step.gain) : limit * between(0.82, 0.88);
			// Never above what the gearing allows at peak rpm.
			speed = Math.min(speed, limit * 0.97);
			// The deliberate rule-breakers: a radar run on sheet 5's last step; sheet 9 measured its
			// last step in January after a July baseline (cold air is far denser).
			const last = s === steps.length - 1;
			const radar = i === 4 && last;
			const winter = i === 8 && last;
			await saveRun(b.id, setupId, {
				runOn: `2025-${winter ? '01' : '07'}-${String(5 + s).padStart(2, '0')}`,
				speed: Math.round(speed * 10) / 10,
				method: radar ? 'radar' : 'gps-logger',
				twoWay: true,
				venue: 'closed-course',
				elevation,
				temp: winter ? -4 : Math.round(between(24, 27)),
				humidity: Math.round(between(40, 50)),
				pressure: null,
				pressureKind: 'sea-level',
				chtFull: Math.round(between(190, 215)),
				chtSensor: 'plug-washer',
				riderMass: 78,
				plugReading: 'tan',
				breakIn: false,
				notes: ''
			});
		}
		const fresh = await builds.read(b.id);
		if (fresh) await setPublication(fresh, 'published');
		added++;
	}
	return added;
}
