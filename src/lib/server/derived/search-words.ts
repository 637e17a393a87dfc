import { QueryTypes } from 'sequelize';
import { buildWords } from '../../search/words';
import { db } from '../db/connection';

/**
 * A build's rows in the search index (search_words, see its migration), rewritten with its
 * listing: its words while it is published and visible, none otherwise; the vocabulary
 * (search_vocabulary) gains the words new to it and loses those no build holds any more.
 */
export async function refreshWords(b: {
	id: number;
	title: string;
	story: string;
	partsText: string;
	open: boolean;
}): Promise<void> {
	const s = db();
	const want = b.open ? buildWords(b.title, b.story, b.partsText) : [];
	const had = (
		await s.query<{ word: string }>('SELECT word FROM search_words WHERE build_id = :id', {
			replacements: { id: b.id },
			type: QueryTypes.SELECT
		})
	).map((r) => r.word);
	// Most saves change no words (a run, a jet): then nothing is written.
	const keep = new Set(want);
	const gone = had.filter((w) => !keep.has(w));
	const known = new Set(had);
	const added = want.filter((w) => !known.has(w));
	if (gone.length) {
		await s.query('DELETE FROM search_words WHERE build_id = :id AND word IN (:gone)', {
			replacements: { id: b.id, gone }
		});
		// A word no build holds any more leaves the vocabulary (one index probe a word).
		await s.query(
			`DELETE FROM search_vocabulary WHERE word IN (:gone)
			AND NOT EXISTS (SELECT 1 FROM search_words w WHERE w.word = search_vocabulary.word)`,
			{ replacements: { gone } }
		);
	}
	if (added.length) {
		await s.query(
			`INSERT IGNORE INTO search_words (word, build_id) VALUES ${added.map(() => '(?, ?)').join(',')}`,
			{ replacements: added.flatMap((w) => [w, b.id]) }
		);
		// In one order, so two saves adding the same words never wait on each other in a circle.
		const sorted = [...added].sort();
		await s.query(
			`INSERT IGNORE INTO search_vocabulary (word) VALUES ${sorted.map(() => '(?)').join(',')}`,
			{ replacements: sorted }
		);
	}
}

/** Takes a build's words out of the index (and the vocabulary) before the build is deleted. */
export const dropWords = (id: number) =>
	refreshWords({ id, title: '', story: '', partsText: '', open: false });
