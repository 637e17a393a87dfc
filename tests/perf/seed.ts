// Synthetic published builds for the benchmark (invented names, fixed seed), written straight into
// the tables in batches. Spreads follow the demo data: 40 % stock 50 cc, 45 % 68 cc kits, 15 %
// bigger; one to four setups a build (the last one is the representative); consecutive setups carry a
// change kind, most with a speed change that counts; two parts a build on average, named from a
// vocabulary of a few thousand invented part names; a short story to search.
import { CHANGE_KINDS } from '../../src/lib/sheet/change-kinds';
import { buildWords } from '../../src/lib/search/words';
import { fillStatements } from '../../src/lib/stats/summary-sql';
import { QueryTypes } from 'sequelize';
import { db } from '../../src/lib/server/db/connection';

export function mulberry32(seed: number) {
	return () => {
		seed = (seed + 0x6d2b79f5) | 0;
		let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
		t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
}

const SYL = [
	'bran',
	'fer',
	'ost',
	'hal',
	'gres',
	'tam',
	'wex',
	'cor',
	'dun',
	'pel',
	'mar',
	'quen',
	'val',
	'kob',
	'tes',
	'rid',
	'cop',
	'nor',
	'har',
	'lin'
];
const ENDS = [
	'noch',
	'row',
	'ley',
	'vard',
	'ley',
	'm',
	'combe',
	'rin',
	'more',
	'lard',
	'by',
	'nel',
	'ance',
	'rin',
	'ly',
	'gel',
	'ton',
	'wick',
	'stead',
	'den'
];
export const MAKERS = SYL.flatMap((a, i) =>
	ENDS.slice(0, 6).map((b) => `${a}${ENDS[(i + b.length) % ENDS.length]}${b}`)
)
	.map((w) => w[0].toUpperCase() + w.slice(1))
	.slice(0, 120);
const ITEMS: [string, string[]][] = [
	['exhaust', ['expansion chamber', 'sport silencer', 'chamber pipe', 'end can']],
	['cylinder', ['70 cc kit', '68 cc sport cylinder', 'plated cylinder', 'cast-iron kit']],
	['carburettor', ['17 mm carburettor', '19 mm carburettor', 'main jet set', 'reed block']],
	['cvt', ['roller set', 'sport variator', 'torque spring', 'clutch springs', 'kevlar belt']],
	['final-drive', ['primary gears', 'secondary gears']],
	['tyres', ['road tyre', 'sport tyre']]
];
export const FAMILIES = Array.from(
	{ length: 24 },
	(_, i) =>
		`${i % 2 ? 'vertical' : 'horizontal'} ${[50, 50, 70, 80][i % 4]} cc ${i % 3 ? 'air' : 'liquid'}-cooled ${i % 5 ? 'two' : 'four'}-stroke, series ${String.fromCharCode(65 + i)}`
);
// Stories draw 12 words from some 320 (trade words and invented ones), so a word is in a few percent
// of the stories, as a real search term would be; the commonest words are FULLTEXT stopwords anyway.
const STORY = [
	...[
		'harbour',
		'valley',
		'plateau',
		'winter',
		'summer',
		'jetting',
		'seized',
		'plug',
		'squish',
		'solder',
		'porting',
		'gearing',
		'logger',
		'radar',
		'course',
		'garage',
		'rebuild',
		'bearing',
		'crank',
		'piston'
	],
	...SYL.flatMap((a) => ENDS.map((b) => `${a}${b}`)).slice(0, 300)
];
const METHODS = ['gps-logger', 'gps-logger', 'phone-gps', 'radar', 'speedometer'];
const PIPES = ['stock', 'sport', 'expansion-chamber'];
const KINDS = CHANGE_KINDS.map((k) => k.kind);

const q = (v: unknown) =>
	v === null ? 'NULL' : typeof v === 'number' ? String(v) : `'${String(v).replace(/'/g, "''")}'`;

export async function seed(
	N: number,
	rnd: () => number,
	opts: { settle?: boolean; reuse?: boolean } = {}
) {
	const pick = <T>(xs: readonly T[]) => xs[Math.floor(rnd() * xs.length)];
	const around = (x: number, spread: number) => x + (rnd() * 2 - 1) * spread;
	const s = db();
	// PERF_KEEP_DATA=1: the database kept from the last run already holds these N builds (the seed
	// is fixed), so a change to the code is timed again without seeding a million builds anew.
	if (opts.reuse) {
		const [had] = await s.query<{ builds: number; setups: number; parts: number }>(
			'SELECT (SELECT COUNT(*) FROM builds) AS builds, (SELECT COUNT(*) FROM setups) AS setups, (SELECT COUNT(*) FROM parts) AS parts',
			{ type: QueryTypes.SELECT }
		);
		if (Number(had.builds) === N) {
			await s.query('ANALYZE TABLE setups, builds, search_words');
			return {
				setups: Number(had.setups),
				parts: Number(had.parts),
				summaries: { filledMs: null, binRows: null, countRows: null },
				reused: true
			};
		}
	}
	await s.query('SET FOREIGN_KEY_CHECKS = 0');
	for (const t of [
		'stat_marks',
		'speed_map_bins',
		'effect_counts',
		'search_words',
		'search_vocabulary',
		'photos',
		'parts',
		'runs',
		'setups',
		'builds'
	])
		await s.query(`TRUNCATE TABLE ${t}`);
	await s.query('SET FOREIGN_KEY_CHECKS = 1');
	await s.query(
		`INSERT IGNORE INTO users (id, name, email, role, units, mail_comments, mail_shop, created_at, updated_at) VALUES ('00000000-0000-4000-8000-00000000beef', 'Bench owner', 'bench@perf.squishline.test', 'member', 'metric', 0, 0, NOW(), NOW())`
	);
	let setupId = 0;
	let partId = 0;
	const batch = 1000;
	for (let start = 0; start < N; start += batch) {
		const b: string[] = [];
		const st: string[] = [];
		const pt: string[] = [];
		const sw: string[] = [];
		for (let i = start; i < Math.min(N, start + batch); i++) {
			const id = i + 1;
			const cls = rnd();
			const cc = cls < 0.4 ? around(49.3, 1) : cls < 0.85 ? around(68, 3) : around(80, 6);
			const cycle = rnd() < 0.9 ? 'two-stroke' : 'four-stroke';
			const family = pick(FAMILIES);
			const setups = 1 + Math.floor(rnd() * 4);
			let best = cc < 55 ? around(52, 7) : around(95, 15);
			const method = pick(METHODS);
			const elev = Math.round(rnd() * 2000);
			const pipe = pick(PIPES);
			let prev: number | null = null;
			let top = 0;
			for (let k = 0; k < setups; k++) {
				setupId++;
				const last = k === setups - 1;
				const kind = k === 0 ? null : rnd() < 0.85 ? pick(KINDS) : 'mixed';
				const step = around(1.5, 3);
				best += k === 0 ? 0 : step;
				top = Math.max(top, best);
				const counts = kind !== null && kind !== 'mixed' && rnd() < 0.75;
				st.push(
					`(${setupId}, ${id}, ${k + 1}, 'bench', '{}', ${q(cycle)}, ${last ? 1 : 0}, 1, ${q(pipe)}, ${cc.toFixed(2)}, ${pick([12, 14, 17, 19, 21])}, ${around(10, 2).toFixed(3)}, ${around(8.5, 2).toFixed(3)}, ${around(1450, 150).toFixed(1)}, ${around(35, 10).toFixed(1)}, ${around(92, 15).toFixed(1)}, ${elev}, ${best.toFixed(1)}, ${q(method)}, ${rnd() < 0.6 ? 1 : 0}, ${q(rnd() < 0.7 ? 'closed-course' : 'private-ground')}, ${around(1.1, 0.1).toFixed(4)}, ${q(family)}, ${prev ?? 'NULL'}, ${q(kind)}, ${counts ? step.toFixed(2) : 'NULL'}, NOW(), NOW())`
				);
				prev = setupId;
			}
			const nParts = Math.floor(rnd() * 5);
			let cost = 0;
			const names: string[] = [];
			for (let k = 0; k < nParts; k++) {
				const [cat, items] = pick(ITEMS);
				const c = Math.round(around(8000, 7000));
				cost += c;
				const name = `${pick(MAKERS)} ${pick(items)}`;
				names.push(name);
				pt.push(`(${++partId}, ${id}, NULL, ${q(cat)}, ${q(name)}, ${c}, NULL, NOW())`);
			}
			const story = Array.from({ length: 12 }, () => pick(STORY)).join(' ');
			const title = `Bench build ${id}: ${pick(MAKERS)} ${Math.round(cc)} cc`;
			// The word index, as the app's listing refresh writes it.
			for (const w of buildWords(title, story, names.join(' · '))) sw.push(`(${q(w)}, ${id})`);
			b.push(
				`(${id}, '00000000-0000-4000-8000-00000000beef', ${q(title)}, ${q(story)}, ${q(names.join(' · '))}, ${q(pipe)}, ${cc.toFixed(2)}, ${elev}, ${q(family)}, ${q(cycle)}, 'published', 'visible', 1, ${setups}, ${top.toFixed(1)}, ${cost}, ${setups}, NOW(), NOW())`
			);
		}
		await s.query(
			`INSERT INTO builds (id, owner_id, title, story, parts_text, rep_pipe, rep_cc, rep_elevation_m, engine_family, engine_cycle, publication, moderation, version, setup_count, best_speed_kmh, parts_total_minor, run_count, created_at, updated_at) VALUES ${b.join(',')}`
		);
		await s.query(
			`INSERT INTO setups (id, build_id, position, change_note, config, engine_cycle, listed, any_listed, exhaust_type, displacement_cc, carb_bore_mm, final_drive_ratio, overall_ratio, tyre_circumference_mm, roller_total_g, sea_level_jet, best_run_elevation_m, best_run_kmh, best_run_method, best_run_two_way, best_run_venue, best_run_density, engine_family, prev_setup_id, change_kind, effect_kmh, created_at, updated_at) VALUES ${st.join(',')}`
		);
		await s.query(`INSERT IGNORE INTO search_words (word, build_id) VALUES ${sw.join(',')}`);
		if (pt.length)
			await s.query(
				`INSERT INTO parts (id, build_id, setup_id, category, name, cost_minor, link, created_at) VALUES ${pt.join(',')}`
			);
	}
	// The vocabulary of the word index, filled as its migration fills it.
	await s.query(
		'INSERT IGNORE INTO search_vocabulary (word) SELECT DISTINCT word FROM search_words'
	);
	// The speed map's and change effects' summaries, filled as their migration fills them.
	const t0 = performance.now();
	for (const sql of fillStatements()) await s.query(sql);
	const summariesFilledMs = Math.round(performance.now() - t0);
	const [rows] = await s.query<{ bins: number; counts: number }>(
		'SELECT (SELECT COUNT(*) FROM speed_map_bins) AS bins, (SELECT COUNT(*) FROM effect_counts) AS counts',
		{ type: QueryTypes.SELECT }
	);
	await s.query(
		'ANALYZE TABLE setups, builds, parts, search_words, stat_marks, speed_map_bins, effect_counts'
	);
	// The quick run checks that the stages work, not their figures: no need to wait for InnoDB.
	if (opts.settle !== false) await settle();
	return {
		setups: setupId,
		parts: partId,
		reused: false,
		summaries: {
			filledMs: summariesFilledMs,
			binRows: Number(rows.bins),
			countRows: Number(rows.counts)
		}
	};
}

/**
 * Waits (up to 30 s) until InnoDB has written out what the seeding left dirty in the buffer pool, so
 * the timings measure a database at rest rather than one still flushing half a gigabyte behind them.
 */
async function settle() {
	const dirty = async () => {
		const [r] = await db().query<{ Value: string }>(
			"SHOW GLOBAL STATUS LIKE 'Innodb_buffer_pool_pages_dirty'",
			{ type: QueryTypes.SELECT }
		);
		return Number(r?.Value ?? 0);
	};
	const until = Date.now() + 30_000;
	while (Date.now() < until && (await dirty()) > 100) await new Promise((r) => setTimeout(r, 250));
}
