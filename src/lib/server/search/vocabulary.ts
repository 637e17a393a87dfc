import Fuse from 'fuse.js';
import { QueryTypes } from 'sequelize';
import { db } from '../db/connection';
import { words } from '../../search/words';

// Typo tolerance. The word index (in the builds list query) matches whole words and prefixes only,
// so a misspelt part name finds nothing. The distinct words of that index — a few thousand, far
// fewer than the builds, kept one row each in search_vocabulary, so this costs the same at a
// million builds as at a thousand — are held here with a fuse.js index; when a search finds
// nothing, each unknown word is swapped for its nearest one and the search runs once more.

const FRESH_MS = 5 * 60_000;
let held: { at: number; known: Set<string>; fuse: Fuse<string> } | null = null;

async function load(now: number) {
	if (held && now - held.at < FRESH_MS) return held;
	const rows = await db().query<{ t: string }>(
		// Words from "a" on: numbers (a build's year, its cc, an id in a title) are never corrected
		// (see `correct`), and there can be as many of them as builds.
		"SELECT word AS t FROM search_vocabulary WHERE word >= 'a' ORDER BY word LIMIT 50000",
		{ type: QueryTypes.SELECT }
	);
	const known = new Set(rows.map((r) => r.t));
	const list = [...known];
	held = {
		at: now,
		known,
		// Threshold 0.4: one or two letters wrong in a word of six or more; short words need a close match.
		fuse: new Fuse(list, {
			includeScore: true,
			threshold: 0.4,
			ignoreLocation: true,
			minMatchCharLength: 3
		})
	};
	return held;
}

/** The query with each unknown word replaced by the nearest known one, or null when nothing changed. */
export async function correct(text: string, now = Date.now()): Promise<string | null> {
	const v = await load(now);
	let changed = false;
	const out = words(text).map((w) => {
		if (v.known.has(w) || /^\d+$/.test(w)) return w;
		const best = v.fuse.search(w, { limit: 1 })[0];
		if (!best) return w;
		changed = true;
		return best.item;
	});
	return changed ? out.join(' ') : null;
}

/** For tests and the benchmark: forget the held vocabulary. */
export function forgetVocabulary() {
	held = null;
}
