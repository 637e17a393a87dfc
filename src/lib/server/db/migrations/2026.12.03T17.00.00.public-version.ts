import { applyAppGrants } from '../grants';
import type { Migration } from '../migrator';

// One number that moves on after every committed change to anything a reader may see
// (db/public-version.ts): whole anonymous answers are kept per process under it
// (web/kept-answers.ts) and read again once it has moved.
export const up: Migration = async ({ context: q }) => {
	const s = q.sequelize;
	await s.query('CREATE TABLE public_version (id TINYINT NOT NULL PRIMARY KEY, v BIGINT NOT NULL)');
	await s.query('INSERT INTO public_version (id, v) VALUES (1, 0)');
	await applyAppGrants(q);
};

export const down: Migration = async ({ context: q }) => {
	await q.dropTable('public_version');
};
