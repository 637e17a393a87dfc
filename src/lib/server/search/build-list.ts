import { QueryTypes } from 'sequelize';
import type { BuildListQuery } from '../../schemas/build-list';
import { EXHAUST_TYPES } from '../../sheet/fields';
import { toCanonical, type Units } from '../../sheet/units';
import { WORD_MAX, words } from '../../search/words';
import { correct } from './vocabulary';
import { db } from '../db/connection';

// The public builds list: filters on the build and on its representative setup (the one close builds
// ranks, `setups.listed`, whose pipe, size and elevation are copied onto the build), keyset pages,
// and search. A page is found in two steps whatever its size:
// the ids in order (the filtering and sorting), then the details of just those rows. How the ids are
// found depends on the filters (see pageIds). A search that finds nothing makes one more try with the
// nearest spelling (see ../search/vocabulary.ts).

export type ListRow = {
	id: number;
	title: string;
	owner: string;
	engineFamily: string;
	bestSpeedKmh: number | null;
	stockSpeedKmh: number | null;
	partsTotalMinor: number;
	currency: string;
	setupCount: number;
	runCount: number;
	displacementCc: number | null;
	exhaust: string | null;
	elevationM: number | null;
	photos: boolean;
	/** The name of a shop an admin has verified that the owner agreed to show on it, if any. */
	verifiedShop: string | null;
};

// Each order walks an index (id; best speed, id; currency, parts total, id), so a page reads about its own
// rows. The id breaks ties in the key's direction. MariaDB sorts NULL speeds last when descending.
const KEY = {
	newest: { col: 'b.id', dir: 'DESC' },
	fastest: { col: 'b.best_speed_kmh', dir: 'DESC' },
	cheapest: { col: 'b.parts_total_minor', dir: 'ASC' }
} as const;

/** The page's conditions and their values. */
function where(q: BuildListQuery, units: Units) {
	const w = ["b.publication = 'published'", "b.moderation = 'visible'"];
	const r: Record<string, unknown> = {};
	const add = (sql: string, name: string, v: unknown) => {
		w.push(sql);
		r[name] = v;
	};
	// A cost order compares like with like: one currency, and only builds with parts listed.
	if (q.sort === 'cheapest') {
		add('b.currency = :currency', 'currency', q.currency ?? 'EUR');
		w.push('b.parts_total_minor > 0');
	}
	if (q.cycle) add('b.engine_cycle = :cycle', 'cycle', q.cycle);
	if (q.family) add('b.engine_family = :family', 'family', q.family);
	if (q.exhaust) add('b.rep_pipe = :exhaust', 'exhaust', q.exhaust);
	if (q.ccMin !== undefined) add('b.rep_cc >= :ccMin', 'ccMin', q.ccMin);
	if (q.ccMax !== undefined) add('b.rep_cc <= :ccMax', 'ccMax', q.ccMax);
	const speed = (v: number) => toCanonical(v, 'speed', units);
	const elev = (v: number) => toCanonical(v, 'elevation', units);
	if (q.speedMin !== undefined) add('b.best_speed_kmh >= :speedMin', 'speedMin', speed(q.speedMin));
	if (q.speedMax !== undefined) add('b.best_speed_kmh <= :speedMax', 'speedMax', speed(q.speedMax));
	if (q.elevMin !== undefined) add('b.rep_elevation_m >= :elevMin', 'elevMin', elev(q.elevMin));
	if (q.elevMax !== undefined) add('b.rep_elevation_m <= :elevMax', 'elevMax', elev(q.elevMax));
	if (q.photos) w.push('EXISTS (SELECT 1 FROM photos ph WHERE ph.build_id = b.id)');
	if (q.runs === '1') w.push('b.run_count > 0');
	return { w, r };
}

const PIPES = ['', ...EXHAUST_TYPES.map((o) => o.value)];
/**
 * How many index entries a filtered page walks in the order's own index before it ranges over the
 * filters instead (see pageIds). Tests set it to 0 (always range) or very high (always walk) to
 * check that both ways find the same pages. The walk reads covering entries only; at this cap a
 * filter it gives up on is passed by fewer than one build in a thousand, so the range after it
 * reads few entries too.
 */
export const LIST_TUNING = { walkCap: 20_000 };
/** A walk that must look each entry's build up (see pageIds) stops sooner. */
const LOOKUP_WALK_CAP = 2000;
const ORDER_INDEX = {
	newest: 'builds_walk_newest',
	fastest: 'builds_walk_fastest',
	cheapest: 'builds_currency_parts'
};
/** A displacement band this many whole cc wide or less is read one whole cc at a time. */
const WHOLE_CC_POINTS = 200;
/** Fastest first reads each (pipe, whole cc) step's own first page when there are this few. */
const TOP_OF_EACH_MAX = 48;

function cursorWhere(q: BuildListQuery) {
	if (!q.cursor) return null;
	const [k, id] = Buffer.from(q.cursor, 'base64url').toString().split(':');
	const cid = Number(id);
	if (!Number.isInteger(cid)) return null;
	const { col, dir } = KEY[q.sort];
	const cmp = dir === 'DESC' ? '<' : '>';
	const after = `(${col} = :ck AND b.id ${cmp} :cid)`;
	// A cursor on a build without a best speed ("null"): only more of those follow.
	if (k === 'null') return { sql: `(${col} IS NULL AND b.id ${cmp} :cid)`, r: { cid } };
	const ck = Number(k);
	if (!Number.isFinite(ck)) return null;
	const nullsAfter = q.sort === 'fastest' ? ` OR ${col} IS NULL` : '';
	return { sql: `(${col} ${cmp} :ck OR ${after}${nullsAfter})`, r: { ck, cid } };
}

/** Each typed word as the indexed words it begins ("cham" → chamber, chambers), at most this many. */
const EXPANSIONS = 20;

/**
 * The indexed words each typed word begins, in one query: a range of the vocabulary (the index's
 * distinct words, search_vocabulary) per typed word, so it costs the same at any number of builds.
 */
async function expand(typed: string[]): Promise<string[][]> {
	const parts = typed.map(
		(_, i) =>
			`(SELECT ${i} AS i, word FROM search_vocabulary WHERE word LIKE :p${i} ORDER BY word LIMIT ${EXPANSIONS})`
	);
	const rows = await db().query<{ i: number; word: string }>(parts.join(' UNION ALL '), {
		replacements: Object.fromEntries(typed.map((w, i) => [`p${i}`, `${w.slice(0, WORD_MAX)}%`])),
		type: QueryTypes.SELECT
	});
	return typed.map((_, i) => rows.filter((r) => Number(r.i) === i).map((r) => r.word));
}

/**
 * The page's ids in order, each way reading a bounded number of index entries:
 * - words to search, newest first: walk the word index (search_words) newest first for each word
 *   the first typed word may be, every entry checked against the other words (and, with filters,
 *   its build), and stop after a page; the walks merge into one page. A common word reads about a
 *   page of index entries;
 * - words in another order: the builds holding every word, filtered, then sorted;
 * - no filter: walk the order's own index and stop after a page;
 * - filters: first walk the order's own index (covering ones for newest and fastest first) until
 *   a page is found or walkCap entries are read, which holds a page whenever one build in a
 *   thousand or so passes; when it does not, the filter is rare: range over the filter columns (builds_by_whole_cc for a displacement
 *   band, whole cc by whole cc with the speed range inside each — fastest first takes each
 *   step's own first page and merges them; builds_list for a pipe or one bound) and sort the
 *   matches, which are then few. (Walking the order alone can pass most
 *   builds by — the fastest are rarely 50 cc; ranging alone reads every build of a wide band.)
 */
async function pageIds(q: BuildListQuery, units: Units, terms: string[][] | null) {
	const { w, r } = where(q, units);
	const c = cursorWhere(q);
	if (c) {
		w.push(c.sql);
		Object.assign(r, c.r);
	}
	const { col, dir } = KEY[q.sort];
	const replacements = { ...r, limit: q.limit + 1 };
	if (terms) {
		// The typed word with the fewest forms leads; every other must be there too.
		const order = terms.map((_, i) => i).sort((a, b) => terms[a].length - terms[b].length);
		const [lead, ...rest] = order;
		const holds = (ref: string) =>
			rest.map(
				(i) =>
					`EXISTS (SELECT 1 FROM search_words t${i} WHERE t${i}.build_id = ${ref} AND t${i}.word IN (:x${i}))`
			);
		rest.forEach((i) => Object.assign(replacements, { [`x${i}`]: terms[i] }));
		if (q.sort === 'newest') {
			// The word index holds listed builds only (derived/search-words.ts), so with no filter
			// but the words the walk reads index entries alone and looks up just the page's builds;
			// a filter joins each entry's build.
			const alone = !filtered(q);
			const conds = alone
				? [...holds('t.build_id'), ...(c ? ['t.build_id < :cid'] : [])]
				: [...w, ...holds('b.id'), ...(c ? ['t.build_id < :cid'] : [])];
			const walks = terms[lead].map((word, k) => {
				Object.assign(replacements, { [`e${k}`]: word });
				const head = alone
					? 'SELECT t.build_id AS id FROM search_words t'
					: 'SELECT STRAIGHT_JOIN t.build_id AS id FROM search_words t JOIN builds b ON b.id = t.build_id';
				return `(${head} WHERE ${['t.word = :e' + k, ...conds].join(' AND ')}
					ORDER BY t.build_id DESC LIMIT :limit)`;
			});
			return db().query<{ id: number; sort_key: number | null }>(
				`SELECT id, id AS sort_key FROM (${walks.join(' UNION ')}) m ORDER BY id DESC LIMIT :limit`,
				{ replacements, type: QueryTypes.SELECT }
			);
		}
		w.push(...holds('b.id'));
		w.push(`b.id IN (SELECT t.build_id FROM search_words t WHERE t.word IN (:lead))`);
		Object.assign(replacements, { lead: terms[lead] });
	}
	if (terms)
		return db().query<{ id: number; sort_key: number | null }>(
			`SELECT b.id, ${col} AS sort_key FROM builds b WHERE ${w.join(' AND ')}
			ORDER BY ${col} ${dir}, b.id ${dir} LIMIT :limit`,
			{ replacements, type: QueryTypes.SELECT }
		);
	const orderOnly = `FORCE INDEX (${ORDER_INDEX[q.sort]})`;
	if (!filtered(q))
		return db().query<{ id: number; sort_key: number | null }>(
			`SELECT b.id, ${col} AS sort_key FROM builds b ${orderOnly} WHERE ${w.join(' AND ')}
			ORDER BY ${col} ${dir}, b.id ${dir} LIMIT :limit`,
			{ replacements, type: QueryTypes.SELECT }
		);
	// A filter that many builds pass: the first entries of the order's own index hold a page. The
	// walk stops at a page or after walkCap entries (MariaDB's LIMIT ROWS EXAMINED), whatever the
	// number of builds; short of a page, the range below answers exactly.
	// A filter on what the order's index does not hold (a family, photos; any filter of cheapest
	// first) looks each entry's row up, so that walk is shorter.
	const covered = q.sort !== 'cheapest' && !q.family && !q.photos;
	const cap = covered ? LIST_TUNING.walkCap : Math.min(LIST_TUNING.walkCap, LOOKUP_WALK_CAP);
	if (cap > 0) {
		const walked = await db().query<{ id: number; sort_key: number | null }>(
			`SELECT b.id, ${col} AS sort_key FROM builds b ${orderOnly} WHERE ${w.join(' AND ')}
			ORDER BY ${col} ${dir}, b.id ${dir} LIMIT :limit ROWS EXAMINED :walkCap`,
			{ replacements: { ...replacements, walkCap: cap }, type: QueryTypes.SELECT }
		);
		if (walked.length >= q.limit + 1) return walked;
	}
	// A filter few builds pass: range over the filters and sort what matches. A displacement band
	// is read one whole cc at a time, each with its own speed range (builds_by_whole_cc), so the
	// entries read are those that match plus the edges of the two outer whole-cc steps.
	const band = q.ccMin !== undefined && q.ccMax !== undefined ? wholeCc(q.ccMin, q.ccMax) : null;
	const byFilters = Boolean(band || q.exhaust || q.ccMin !== undefined || q.ccMax !== undefined);
	const index = !byFilters
		? orderOnly
		: band
			? 'FORCE INDEX (builds_by_whole_cc)'
			: 'FORCE INDEX (builds_list)';
	const pipes = q.exhaust ? [q.exhaust] : PIPES;
	// Fastest first over a few whole-cc steps: each (pipe, whole cc) is already in speed order in
	// the index, so the page is the best of each step's own first page — a page per step read,
	// however many builds match.
	if (band && q.sort === 'fastest' && pipes.length * band.length <= TOP_OF_EACH_MAX) {
		const steps = pipes.flatMap((pipe, i) =>
			band.map((whole, j) => {
				Object.assign(replacements, { [`sp${i}`]: pipe, [`sw${j}`]: whole });
				return `(SELECT b.id, ${col} AS sort_key FROM builds b ${index}
					WHERE ${w.join(' AND ')} AND b.rep_pipe = :sp${i} AND b.rep_cc_whole = :sw${j}
					ORDER BY ${col} ${dir}, b.id ${dir} LIMIT :limit)`;
			})
		);
		return db().query<{ id: number; sort_key: number | null }>(
			`SELECT id, sort_key FROM (${steps.join(' UNION ALL ')}) m ORDER BY sort_key ${dir}, id ${dir} LIMIT :limit`,
			{ replacements, type: QueryTypes.SELECT }
		);
	}
	if (byFilters) {
		if (!q.exhaust) {
			w.push('b.rep_pipe IN (:pipes)');
			Object.assign(replacements, { pipes: PIPES });
		}
		if (band) {
			w.push('b.rep_cc_whole IN (:wholes)');
			Object.assign(replacements, { wholes: band });
		}
	}
	return db().query<{ id: number; sort_key: number | null }>(
		`SELECT b.id, ${col} AS sort_key FROM builds b ${index} WHERE ${w.join(' AND ')}
		ORDER BY ${col} ${dir}, b.id ${dir} LIMIT :limit`,
		{ replacements, type: QueryTypes.SELECT }
	);
}

/** Whether a page filters on anything but the order's own bounds. */
const filtered = (q: BuildListQuery) =>
	Boolean(
		q.cycle ||
		q.family ||
		q.exhaust ||
		q.photos ||
		q.runs === '1' ||
		[q.ccMin, q.ccMax, q.speedMin, q.speedMax, q.elevMin, q.elevMax].some((v) => v !== undefined)
	);

/** The whole cc values a band covers, when few enough to read one at a time. */
function wholeCc(min: number, max: number): number[] | null {
	const lo = Math.floor(min);
	const hi = Math.floor(max);
	if (hi < lo || hi - lo + 1 > WHOLE_CC_POINTS) return null;
	return Array.from({ length: hi - lo + 1 }, (_, k) => lo + k);
}

async function page(q: BuildListQuery, units: Units, terms: string[][] | null) {
	// A typed word that begins no indexed word: nothing can match.
	const ids = terms?.some((t) => !t.length) ? [] : await pageIds(q, units, terms);
	const more = ids.length > q.limit;
	const mine = ids.slice(0, q.limit);
	const last = mine.at(-1);
	return {
		builds: await listRows(mine.map((x) => Number(x.id))),
		next:
			more && last
				? Buffer.from(
						`${last.sort_key === null ? 'null' : Number(last.sort_key)}:${last.id}`
					).toString('base64url')
				: null
	};
}

/**
 * The list's rows for these builds, in the order given, listed builds only (a build hidden or
 * unpublished since its id was found is left out). One query, whatever the number of ids.
 */
export async function listRows(ids: number[]): Promise<ListRow[]> {
	if (!ids.length) return [];
	const rows = await db().query<Record<string, unknown>>(
		`SELECT b.id, b.title, b.engine_family, b.best_speed_kmh, b.stock_speed_kmh, b.parts_total_minor,
			b.currency, b.setup_count, b.run_count, u.name AS owner,
			b.rep_cc, b.rep_pipe, b.rep_elevation_m,
			EXISTS (SELECT 1 FROM photos ph WHERE ph.build_id = b.id) AS photos,
			(SELECT sh.name FROM shop_links sl JOIN shops sh ON sh.id = sl.shop_id
				WHERE sl.build_id = b.id AND sl.state = 'approved' AND sh.verified_at IS NOT NULL
				AND sh.moderation = 'visible' ORDER BY sl.id LIMIT 1) AS verified_shop,
			b.owner_id IS NULL AS owner_gone
		FROM builds b
		LEFT JOIN users u ON u.id = b.owner_id
		WHERE b.id IN (:ids) AND b.publication = 'published' AND b.moderation = 'visible'`,
		{ replacements: { ids }, type: QueryTypes.SELECT }
	);
	const byId = new Map(rows.map((x) => [Number(x.id), toRow(x)]));
	return ids.map((id) => byId.get(id)).filter((r): r is ListRow => Boolean(r));
}

const n = (v: unknown) => (v === null || v === undefined ? null : Number(v));
function toRow(x: Record<string, unknown>): ListRow {
	return {
		id: Number(x.id),
		title: String(x.title),
		owner: Number(x.owner_gone) ? 'a former member' : ((x.owner as string | null) ?? 'a member'),
		engineFamily: String(x.engine_family ?? ''),
		bestSpeedKmh: n(x.best_speed_kmh),
		stockSpeedKmh: n(x.stock_speed_kmh),
		partsTotalMinor: Number(x.parts_total_minor),
		currency: String(x.currency),
		setupCount: Number(x.setup_count),
		runCount: Number(x.run_count),
		displacementCc: n(x.rep_cc),
		exhaust: (x.rep_pipe as string) || null,
		elevationM: n(x.rep_elevation_m),
		photos: Boolean(Number(x.photos)),
		verifiedShop: (x.verified_shop as string | null) ?? null
	};
}

/**
 * A page of the list. With words to search for and nothing found on the first page, the nearest
 * known spelling is tried once; `didYouMean` then says what was searched instead.
 */
export async function listBuilds(q: BuildListQuery, units: Units) {
	const typed = q.q ? words(q.q) : [];
	// Only short words or stopwords: list without searching, and say so.
	if (q.q && !typed.length)
		return { ...(await page(q, units, null)), didYouMean: null, ignored: true };
	const first = await page(q, units, typed.length ? await expand(typed) : null);
	if (!q.q || first.builds.length || q.cursor)
		return { ...first, didYouMean: null, ignored: false };
	const fixed = await correct(q.q);
	const fixedWords = fixed ? words(fixed) : [];
	if (!fixed || !fixedWords.length) return { ...first, didYouMean: null, ignored: false };
	return { ...(await page(q, units, await expand(fixedWords))), didYouMean: fixed, ignored: false };
}
