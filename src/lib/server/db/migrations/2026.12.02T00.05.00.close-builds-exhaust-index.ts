import type { Migration } from '../migrator';

// A second covering index led by the pipe type: when the reader names an exhaust, the prefilter
// takes that pipe type's builds in the displacement band, a third of the rows the band alone holds.
const RANKED = [
	'displacement_cc',
	'carb_bore_mm',
	'final_drive_ratio',
	'tyre_circumference_mm',
	'roller_total_g',
	'sea_level_jet',
	'best_run_elevation_m',
	'best_run_kmh',
	'build_id'
];

export const up: Migration = async ({ context: q }) => {
	await q.addIndex('setups', ['listed', 'engine_cycle', 'exhaust_type', ...RANKED], {
		name: 'setups_close_by_exhaust'
	});
	await q.addIndex('setups', ['any_listed', 'engine_cycle', 'exhaust_type', ...RANKED], {
		name: 'setups_close_all_by_exhaust'
	});
};

export const down: Migration = async ({ context: q }) => {
	await q.removeIndex('setups', 'setups_close_all_by_exhaust');
	await q.removeIndex('setups', 'setups_close_by_exhaust');
};
