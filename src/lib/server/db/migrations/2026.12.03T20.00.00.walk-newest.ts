import type { Migration } from '../migrator';

// Newest first with filters walks an index in id order that holds every column those filters read
// (search/build-list.ts), so the walk reads index entries only, as fastest first already does.
export const up: Migration = async ({ context: q }) => {
	await q.addIndex(
		'builds',
		[
			'publication',
			'moderation',
			'id',
			'rep_pipe',
			'rep_cc',
			'best_speed_kmh',
			'rep_elevation_m',
			'engine_cycle',
			'run_count'
		],
		{ name: 'builds_walk_newest' }
	);
};

export const down: Migration = async ({ context: q }) => {
	await q.removeIndex('builds', 'builds_walk_newest');
};
