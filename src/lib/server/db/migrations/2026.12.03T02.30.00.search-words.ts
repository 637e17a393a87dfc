import { DataTypes, QueryTypes } from 'sequelize';
import { applyAppGrants } from '../grants';
import type { Migration } from '../migrator';
import { buildWords } from '../../../search/words';

// Search by a B-tree of words: one row per distinct word of each listed build's title, story and
// parts (the words FULLTEXT indexed). The list walks one word's entries newest first and stops
// after a page, where FULLTEXT had to hand over every match (15,000 for a common word) to be
// sorted. The distinct words are also the typo vocabulary, read from the index, not rebuilt.
export const up: Migration = async ({ context: q }) => {
	await q.createTable('search_words', {
		word: { type: DataTypes.STRING(40), allowNull: false, primaryKey: true },
		build_id: {
			type: DataTypes.INTEGER,
			allowNull: false,
			primaryKey: true,
			references: { model: 'builds', key: 'id' },
			onDelete: 'CASCADE'
		}
	});
	await q.addIndex('search_words', ['build_id'], { name: 'search_words_build' });
	const s = q.sequelize;
	let after = 0;
	for (;;) {
		const rows = await s.query<{ id: number; title: string; story: string; parts_text: string }>(
			`SELECT id, title, story, parts_text FROM builds
			WHERE publication = 'published' AND moderation = 'visible' AND id > :after ORDER BY id LIMIT 2000`,
			{ replacements: { after }, type: QueryTypes.SELECT }
		);
		if (!rows.length) break;
		const pairs = rows.flatMap((b) =>
			buildWords(b.title, b.story, b.parts_text).map((w) => [w, b.id])
		);
		if (pairs.length)
			await s.query(
				`INSERT IGNORE INTO search_words (word, build_id) VALUES ${pairs.map(() => '(?, ?)').join(',')}`,
				{
					replacements: pairs.flat()
				}
			);
		after = rows.at(-1)!.id;
	}
	await applyAppGrants(q);
};

export const down: Migration = async ({ context: q }) => {
	await q.dropTable('search_words');
};
