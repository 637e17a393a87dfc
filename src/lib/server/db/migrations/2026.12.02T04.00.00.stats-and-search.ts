import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// Columns and indexes for the speed map, change effects, the builds list's filters and search.
// Every setup carries what its best run was measured with (method, two-way, venue, air density) and
// its build's engine family, so the speed map (one mark per build: its representative setup) aggregates over one covering index
// with no join. A
// setup also knows the setup before it, the kind of change it made and, when the pair passes the
// rules in src/lib/sheet/change-kinds.ts, the speed change: change effects is then one index scan.
const SPEED_MAP = [
	'listed',
	'best_run_method',
	'close_pipe',
	'best_run_two_way',
	'best_run_venue',
	'engine_cycle',
	'engine_family',
	'displacement_cc',
	'final_drive_ratio',
	'overall_ratio',
	'sea_level_jet',
	'roller_total_g',
	'best_run_elevation_m',
	'best_run_kmh',
	'build_id'
];

export const up: Migration = async ({ context: q }) => {
	const real = { type: DataTypes.DOUBLE, allowNull: true };
	await q.addColumn('setups', 'prev_setup_id', { type: DataTypes.INTEGER, allowNull: true });
	await q.addColumn('setups', 'change_kind', { type: DataTypes.STRING(20), allowNull: true });
	await q.addColumn('setups', 'effect_kmh', real);
	await q.addColumn('setups', 'best_run_density', real);
	await q.addColumn('setups', 'best_run_two_way', { type: DataTypes.BOOLEAN, allowNull: true });
	await q.addColumn('setups', 'best_run_venue', { type: DataTypes.STRING(20), allowNull: true });
	await q.addColumn('setups', 'engine_family', {
		type: DataTypes.STRING(120),
		allowNull: false,
		defaultValue: ''
	});
	await q.sequelize.query(
		'UPDATE setups s JOIN runs r ON r.id = s.best_run_id SET s.best_run_density = r.air_density, s.best_run_two_way = r.two_way, s.best_run_venue = r.venue'
	);
	await q.sequelize.query(
		'UPDATE setups s JOIN builds b ON b.id = s.build_id SET s.engine_family = b.engine_family'
	);
	await q.addIndex('setups', SPEED_MAP, { name: 'setups_speed_map' });
	await q.addIndex('setups', ['any_listed', 'change_kind', 'effect_kmh', 'build_id'], {
		name: 'setups_change_effects'
	});
	await q.addIndex('builds', ['engine_family'], { name: 'builds_engine_family' });
	await q.addIndex('builds', ['best_speed_kmh', 'id'], { name: 'builds_best_speed' });
	await q.addIndex('builds', ['parts_total_minor', 'id'], { name: 'builds_parts_total' });
	// The builds list filters on the latest measured setup's pipe, size and elevation: copied onto the
	// build (like its best speed) so the list reads one table, with a covering index for the filters.
	await q.addColumn('builds', 'rep_pipe', {
		type: DataTypes.STRING(20),
		allowNull: false,
		defaultValue: ''
	});
	await q.addColumn('builds', 'rep_cc', real);
	await q.addColumn('builds', 'rep_elevation_m', real);
	await q.sequelize.query(
		"UPDATE builds b JOIN setups s ON s.build_id = b.id AND s.listed = 1 SET b.rep_pipe = COALESCE(s.exhaust_type, ''), b.rep_cc = s.displacement_cc, b.rep_elevation_m = s.best_run_elevation_m"
	);
	await q.addIndex(
		'builds',
		[
			'publication',
			'moderation',
			'rep_pipe',
			'rep_cc',
			'best_speed_kmh',
			'parts_total_minor',
			'rep_elevation_m',
			'engine_cycle',
			'id'
		],
		{ name: 'builds_list' }
	);
	// Search: the part names are copied onto their build (on every save), so one FULLTEXT index
	// covers title, story and parts and a search is a single MATCH.
	await q.addColumn('builds', 'parts_text', {
		type: DataTypes.TEXT,
		allowNull: false,
		defaultValue: ''
	});
	await q.sequelize.query(
		"UPDATE builds b SET parts_text = COALESCE((SELECT GROUP_CONCAT(p.name ORDER BY p.id SEPARATOR ' · ') FROM parts p WHERE p.build_id = b.id), '')"
	);
	await q.sequelize.query(
		'ALTER TABLE builds ADD FULLTEXT INDEX builds_text (title, story, parts_text)'
	);
};

export const down: Migration = async ({ context: q }) => {
	await q.removeIndex('builds', 'builds_text');
	await q.removeColumn('builds', 'parts_text');
	await q.removeIndex('builds', 'builds_list');
	for (const c of ['rep_elevation_m', 'rep_cc', 'rep_pipe']) await q.removeColumn('builds', c);
	await q.removeIndex('builds', 'builds_parts_total');
	await q.removeIndex('builds', 'builds_best_speed');
	await q.removeIndex('builds', 'builds_engine_family');
	await q.removeIndex('setups', 'setups_change_effects');
	await q.removeIndex('setups', 'setups_speed_map');
	for (const c of [
		'engine_family',
		'best_run_venue',
		'best_run_two_way',
		'best_run_density',
		'effect_kmh',
		'change_kind',
		'prev_setup_id'
	])
		await q.removeColumn('setups', c);
};
