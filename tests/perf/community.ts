// The builds list, the speed map, change effects and search at scale, each through the function its
// route calls.
import { buildListSchema } from '../../src/lib/schemas/build-list';
import { listBuilds } from '../../src/lib/server/search/build-list';
import { forgetVocabulary } from '../../src/lib/server/search/vocabulary';
import { pairsFor, summarise } from '../../src/lib/server/stats/change-effects';
import { speedMap } from '../../src/lib/server/stats/speed-map';
import { CHANGE_KINDS, type ChangeKind } from '../../src/lib/sheet/change-kinds';
import { speedMapQuerySchema } from '../../src/lib/schemas/stats';
import { SPEED_MAP_X } from '../../src/lib/stats/speed-map-axes';
import { FAMILIES, MAKERS } from './seed';
import { time } from './timing';

const PIPES = ['stock', 'sport', 'expansion-chamber'];
const WORDS = [
	'chamber',
	'silencer',
	'variator',
	'roller',
	'carburettor',
	'plated',
	'torque',
	'gears',
	'harbour',
	'plateau',
	'seized',
	'squish'
];

/** Two letters swapped in the middle: the kind of slip a thumb makes on a phone. */
const typo = (w: string) => {
	const i = Math.max(1, Math.floor(w.length / 2) - 1);
	return w.slice(0, i) + w[i + 1] + w[i] + w.slice(i + 2);
};

export async function benchCommunity(rnd: () => number, runs: number) {
	const pick = <T>(xs: readonly T[]) => xs[Math.floor(rnd() * xs.length)];
	// The list with three filters (pipe, a displacement band, a speed floor), newest first.
	const lists = Array.from({ length: runs }, () => {
		const lo = pick([45, 60, 65, 70, 75]);
		return buildListSchema.parse({
			exhaust: pick(PIPES),
			ccMin: lo,
			ccMax: lo + pick([5, 10, 20]),
			speedMin: pick([0, 40, 60, 80, 100]),
			sort: pick(['newest', 'fastest'])
		});
	});
	const maps = Array.from({ length: runs }, () =>
		speedMapQuerySchema.parse({
			x: pick(Object.keys(SPEED_MAP_X)),
			method: rnd() < 0.5 ? pick(['gps-logger', 'radar']) : undefined,
			pipe: rnd() < 0.5 ? pick(PIPES) : undefined,
			twoWay: rnd() < 0.3 ? '1' : undefined,
			family: rnd() < 0.2 ? pick(FAMILIES) : undefined
		})
	);
	const kinds = CHANGE_KINDS.map((k) => k.kind as ChangeKind);
	// Part makers, part words and story words; one in five misspelt.
	const searches = Array.from({ length: runs }, () => {
		const w = rnd() < 0.5 ? pick(MAKERS).toLowerCase() : pick(WORDS);
		return buildListSchema.parse({ q: rnd() < 0.2 ? typo(w) : w });
	});
	forgetVocabulary();
	const t0 = performance.now();
	await listBuilds(buildListSchema.parse({ q: typo('chamber') }), 'metric');
	const vocabularyMs = performance.now() - t0; // the first misspelt search loads the vocabulary
	let a = 0;
	let b = 0;
	let c = 0;
	let d = 0;
	return {
		list: await time(runs, () => listBuilds(lists[a++ % runs], 'metric')),
		speedMap: await time(runs, () => speedMap(maps[b++ % runs])),
		changeEffects: await time(runs, async () => {
			const k = kinds[c++ % kinds.length];
			await Promise.all([summarise(), pairsFor(k)]);
		}),
		search: await time(runs, () => listBuilds(searches[d++ % runs], 'metric')),
		vocabularyMs
	};
}
