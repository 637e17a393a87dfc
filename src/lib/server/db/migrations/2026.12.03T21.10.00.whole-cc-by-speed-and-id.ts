import type { Migration } from '../migrator';

// Fastest first over a few whole-cc steps reads each step's own first page
// (search/build-list.ts). The page is ordered by speed and then id, so the index carries id right
// after the speed: with another column between them MariaDB sorted every entry of each step.
const COLUMNS = (idAfterSpeed: boolean) => [
	'publication',
	'moderation',
	'rep_pipe',
	'rep_cc_whole',
	'best_speed_kmh',
	...(idAfterSpeed ? ['id'] : []),
	'rep_cc',
	'rep_elevation_m',
	'engine_cycle',
	'run_count',
	'parts_total_minor',
	...(idAfterSpeed ? [] : ['id'])
];

export const up: Migration = async ({ context: q }) => {
	await q.removeIndex('builds', 'builds_by_whole_cc');
	await q.addIndex('builds', COLUMNS(true), { name: 'builds_by_whole_cc' });
};

export const down: Migration = async ({ context: q }) => {
	await q.removeIndex('builds', 'builds_by_whole_cc');
	await q.addIndex('builds', COLUMNS(false), { name: 'builds_by_whole_cc' });
};
