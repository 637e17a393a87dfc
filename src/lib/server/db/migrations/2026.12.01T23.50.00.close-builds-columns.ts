import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// Columns and covering indexes for ranking close builds in SQL. `listed` marks a published build's
// representative setup (its latest setup with a run); `any_listed` every published setup with a run.
// The indexes start with the prefilter (flag, cycle, displacement band) and carry every ranked
// column, so the ranking scan reads index entries only.
const RANKED = [
	'displacement_cc',
	'exhaust_type',
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
	await q.addColumn('setups', 'engine_cycle', {
		type: DataTypes.ENUM('two-stroke', 'four-stroke'),
		allowNull: false,
		defaultValue: 'two-stroke'
	});
	await q.addColumn('setups', 'listed', {
		type: DataTypes.BOOLEAN,
		allowNull: false,
		defaultValue: false
	});
	await q.addColumn('setups', 'any_listed', {
		type: DataTypes.BOOLEAN,
		allowNull: false,
		defaultValue: false
	});
	await q.addColumn('setups', 'best_run_elevation_m', { type: DataTypes.DOUBLE, allowNull: true });
	await q.addColumn('setups', 'best_run_method', { type: DataTypes.STRING(20), allowNull: true });
	// Backfill what the app writes on every save from now on.
	await q.sequelize.query(
		'UPDATE setups s JOIN runs r ON r.id = s.best_run_id SET s.best_run_elevation_m = r.elevation_m, s.best_run_method = r.method'
	);
	await q.sequelize.query(
		"UPDATE setups s JOIN builds b ON b.id = s.build_id SET s.engine_cycle = b.engine_cycle, s.any_listed = (b.publication = 'published' AND b.moderation = 'visible' AND s.best_run_kmh IS NOT NULL)"
	);
	await q.sequelize.query(
		"UPDATE setups s JOIN (SELECT build_id, MAX(position) AS p FROM setups WHERE best_run_kmh IS NOT NULL GROUP BY build_id) m ON m.build_id = s.build_id AND m.p = s.position JOIN builds b ON b.id = s.build_id SET s.listed = (b.publication = 'published' AND b.moderation = 'visible')"
	);
	await q.addIndex('setups', ['listed', 'engine_cycle', ...RANKED], {
		name: 'setups_close_representative'
	});
	await q.addIndex('setups', ['any_listed', 'engine_cycle', ...RANKED], {
		name: 'setups_close_all'
	});
};

export const down: Migration = async ({ context: q }) => {
	await q.removeIndex('setups', 'setups_close_all');
	await q.removeIndex('setups', 'setups_close_representative');
	for (const c of [
		'best_run_method',
		'best_run_elevation_m',
		'any_listed',
		'listed',
		'engine_cycle'
	])
		await q.removeColumn('setups', c);
};
