import { DataTypes } from 'sequelize';
import { applyAppGrants } from '../grants';
import type { Migration } from '../migrator';

// The distinct words of the word index, one row each, kept with it on every change
// (derived/search-words.ts). A search expands a typed prefix and the typo correction reads its
// vocabulary here, reading about as many rows as it wants; over the word index itself MariaDB read
// every entry of a common word first (a million for "build" at a million builds).
export const up: Migration = async ({ context: q }) => {
	await q.createTable('search_vocabulary', {
		word: { type: DataTypes.STRING(40), allowNull: false, primaryKey: true }
	});
	await q.sequelize.query(
		'INSERT INTO search_vocabulary (word) SELECT DISTINCT word FROM search_words'
	);
	await applyAppGrants(q);
};

export const down: Migration = async ({ context: q }) => {
	await q.dropTable('search_vocabulary');
};
