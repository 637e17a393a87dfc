import type { Migration } from '../migrator';

// For a base scooter given without a displacement, the displacement-led indexes have nothing narrow to
// range over. This index is led by pipe type and carburettor bore instead. `close_pipe` is the pipe
// type with '' for unknown (a generated column with no NULLs), so "any pipe" is a list of points and
// the carburettor bore range still applies inside each. The ranked columns ride along as before.
const COVER = [
	'displacement_cc',
	'final_drive_ratio',
	'tyre_circumference_mm',
	'roller_total_g',
	'sea_level_jet',
	'best_run_elevation_m',
	'best_run_kmh',
	'build_id'
];
const INDEXES = [
	['setups_close_by_carb', 'listed'],
	['setups_close_all_by_carb', 'any_listed']
] as const;

export const up: Migration = async ({ context: q }) => {
	await q.sequelize.query(
		"ALTER TABLE setups ADD COLUMN close_pipe VARCHAR(20) AS (COALESCE(exhaust_type, '')) PERSISTENT"
	);
	for (const [name, flag] of INDEXES)
		await q.addIndex('setups', [flag, 'engine_cycle', 'close_pipe', 'carb_bore_mm', ...COVER], {
			name
		});
};

export const down: Migration = async ({ context: q }) => {
	for (const [name] of INDEXES) await q.removeIndex('setups', name);
	await q.removeColumn('setups', 'close_pipe');
};
