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

/**
 * The page's conditions. `bounds` are those an index walk in the page's order can start and stop
 * by (visibility, the order's own column, the cursor, which pageIds adds); the rest are read from
 * each entry.
 */
function where(q: BuildListQuery, units: Units) {
	const w = ["b.publication = 'published'", "b.moderation = 'visible'"];
	const bounds = new Set(w);
	const r: Record<string, unknown> = {};
	const add = (sql: string, name: string, v: unknown) => {
		w.push(sql);
		r[name] = v;
		if (sql.startsWith(KEY[q.sort].col)) bounds.add(sql);
	};
	// A cost order compares like with like: one currency, and only builds with parts listed.
	if (q.sort === 'cheapest') {
		add('b.currency = :currency', 'currency', q.currency ?? 'EUR');
		w.push('b.parts_total_minor > 0');
		bounds.add('b.currency = :currency').add('b.parts_total_minor > 0');
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
	return { w, r, bounds };
}

const PIPES = ['', ...EXHAUST_TYPES.map((o) => o.value)];
/**
 * How many index entries a filtered page walks in the order's own index before it ranges over the
 * filters instead (see pageIds). Tests set it to 0 (always range) or very high (always walk) to
 * check that both ways find the same pages.
 */
export const LIST_TUNING = { walkCap: 2000 };
const ORDER_INDEX = {
	newest: 'PRIMARY',
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
 * The indexed words each typed word begins, in one query: a range of the word index per typed word,
 * one entry per distinct word (a loose index scan), so it costs the same at any number of builds.
 */
async function expand(typed: string[]): Promise<string[][]> {
	const parts = typed.map(
		(_, i) =>
			`(SELECT ${i} AS i, word FROM search_words WHERE word LIKE :p${i} GROUP BY word LIMIT ${EXPANSIONS})`
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
 *   the first typed word may be, every build checked against the other words and the filters, and
 *   stop after a page; the walks merge into one page. A common word reads about a page of entries;
 * - words in another order: the builds holding every word, filtered, then sorted;
 * - no filter: walk the order's own index and stop after a page;
 * - filters: first walk the order's own index (a covering one for fastest first) for at most
 *   walkCap entries, which holds a page whenever one build in a hundred or so passes; when it does
 *   not, the filter is rare: range over the filter columns (builds_by_whole_cc for a displacement
 *   band, whole cc by whole cc with the speed range inside each — fastest first takes each
 *   step's own first page and merges them; builds_list for a pipe or one bound) and sort the
 *   matches, which are then few. (Walking the order alone can pass most
 *   builds by — the fastest are rarely 50 cc; ranging alone reads every build of a wide band.)
 */
async function pageIds(q: BuildListQuery, units: Units, terms: string[][] | null) {
	const { w, r, bounds } = where(q, units);
	const c = cursorWhere(q);
	if (c) {
		w.push(c.sql);
		bounds.add(c.sql);
		Object.assign(r, c.r);
	}
	const { col, dir } = KEY[q.sort];
	const replacements = { ...r, limit: q.limit + 1 };
	if (terms) {
		// The typed word with the fewest forms leads; every other must be there too.
		const order = terms.map((_, i) => i).sort((a, b) => terms[a].length - terms[b].length);
		const [lead, ...rest] = order;
		rest.forEach((i) => {
			w.push(
				`EXISTS (SELECT 1 FROM search_words t${i} WHERE t${i}.build_id = b.id AND t${i}.word IN (:x${i}))`
			);
			Object.assign(replacements, { [`x${i}`]: terms[i] });
		});
		if (q.sort === 'newest') {
			if (c) w.push('t.build_id < :cid');
			const walks = terms[lead].map((word, k) => {
				Object.assign(replacements, { [`e${k}`]: word });
				return `(SELECT STRAIGHT_JOIN t.build_id AS id FROM search_words t JOIN builds b ON b.id = t.build_id
					WHERE t.word = :e${k} AND ${w.join(' AND ')} ORDER BY t.build_id DESC LIMIT :limit)`;
			});
			return db().query<{ id: number; sort_key: number | null }>(
				`SELECT id, id AS sort_key FROM (${walks.join(' UNION ')}) m ORDER BY id DESC LIMIT :limit`,
				{ replacements, type: QueryTypes.SELECT }
			);
		}
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
	// A filter that many builds pass: the first entries of the order's own index hold a page.
	// The walk reads at most walkCap of them (the inner LIMIT), whatever the number of builds;
	// the conditions on the order's own column bound it from inside.
	if (LIST_TUNING.walkCap > 0) {
		const inner = w.filter((x) => bounds.has(x));
		const rest = w.filter((x) => !bounds.has(x));
		const walked = await db().query<{ id: number; sort_key: number | null }>(
			`SELECT v.id, v.sort_key FROM (
				SELECT b.id, ${col} AS sort_key, ${rest.length ? rest.join(' AND ') : 'TRUE'} AS ok
				FROM builds b ${orderOnly} WHERE ${inner.join(' AND ')}
				ORDER BY ${col} ${dir}, b.id ${dir} LIMIT :walkCap
			) v WHERE v.ok ORDER BY v.sort_key ${dir}, v.id ${dir} LIMIT :limit`,
			{ replacements: { ...replacements, walkCap: LIST_TUNING.walkCap }, type: QueryTypes.SELECT }
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
	const rows = mine.length
		? await db().query<Record<string, unknown>>(
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
			WHERE b.id IN (:ids)`,
				{ replacements: { ids: mine.map((x) => x.id) }, type: QueryTypes.SELECT }
			)
		: [];
	const byId = new Map(rows.map((x) => [Number(x.id), toRow(x)]));
	return {
		builds: mine.map((x) => byId.get(Number(x.id))!).filter(Boolean),
		next:
			more && last
				? Buffer.from(
						`${last.sort_key === null ? 'null' : Number(last.sort_key)}:${last.id}`
					).toString('base64url')
				: null
	};
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
