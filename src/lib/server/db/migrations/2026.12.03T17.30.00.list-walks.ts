import type { Migration } from '../migrator';

// The builds list reads a bounded number of index entries at any data size (search/build-list.ts):
// - fastest first walks its own covering index (published and visible, speed, id, then every
//   column the filters read), so a page of a common filter is found in the first entries;
// - a filter too rare for that walk ranges over displacement by whole cc (a stored copy of its
//   whole number), each whole cc with its own speed range, so it reads the builds that match and
//   the edges of two whole-cc steps, not every build of the band.
export const up: Migration = async ({ context: q }) => {
	const s = q.sequelize;
	await s.query(
		'ALTER TABLE builds ADD COLUMN rep_cc_whole SMALLINT AS (FLOOR(rep_cc)) PERSISTENT, ALGORITHM=COPY'
	);
	await q.addIndex(
		'builds',
		[
			'publication',
			'moderation',
			'best_speed_kmh',
			'id',
			'rep_pipe',
			'rep_cc',
			'rep_elevation_m',
			'engine_cycle',
			'run_count'
		],
		{ name: 'builds_walk_fastest' }
	);
	await q.addIndex(
		'builds',
		[
			'publication',
			'moderation',
			'rep_pipe',
			'rep_cc_whole',
			'best_speed_kmh',
			'rep_cc',
			'rep_elevation_m',
			'engine_cycle',
			'run_count',
			'parts_total_minor',
			'id'
		],
		{ name: 'builds_by_whole_cc' }
	);
};

export const down: Migration = async ({ context: q }) => {
	await q.removeIndex('builds', 'builds_by_whole_cc');
	await q.removeIndex('builds', 'builds_walk_fastest');
	await q.removeColumn('builds', 'rep_cc_whole');
};
