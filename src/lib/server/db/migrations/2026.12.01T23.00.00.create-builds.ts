import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// Build sheets. A setup's full configuration is one JSON document (validated by its zod schema);
// the numbers later queries rank and filter on are real, indexed columns written on every save.
export const up: Migration = async ({ context: q }) => {
	const now = { type: DataTypes.DATE, allowNull: false };
	const str = (n = 160) => ({ type: DataTypes.STRING(n), allowNull: false, defaultValue: '' });
	const real = { type: DataTypes.DOUBLE, allowNull: true };
	await q.createTable('builds', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		owner_id: {
			type: DataTypes.UUID,
			allowNull: false,
			references: { model: 'users', key: 'id' },
			onDelete: 'CASCADE'
		},
		title: { type: DataTypes.STRING(120), allowNull: false },
		story: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
		chassis: str(),
		engine_family: str(120),
		engine_cycle: {
			type: DataTypes.ENUM('two-stroke', 'four-stroke'),
			allowNull: false,
			defaultValue: 'two-stroke'
		},
		cooling: { type: DataTypes.ENUM('air', 'liquid'), allowNull: false, defaultValue: 'air' },
		cylinder_orientation: {
			type: DataTypes.ENUM('horizontal', 'vertical'),
			allowNull: false,
			defaultValue: 'horizontal'
		},
		brake_front: str(120),
		brake_rear: str(120),
		brakes_upgraded: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
		currency: { type: DataTypes.CHAR(3), allowNull: false, defaultValue: 'EUR' },
		publication: {
			type: DataTypes.ENUM('draft', 'published'),
			allowNull: false,
			defaultValue: 'draft'
		},
		published_at: { type: DataTypes.DATE, allowNull: true },
		moderation: {
			type: DataTypes.ENUM('visible', 'hidden'),
			allowNull: false,
			defaultValue: 'visible'
		},
		hidden_reason: { type: DataTypes.STRING(500), allowNull: true },
		version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
		best_speed_kmh: real,
		stock_speed_kmh: real,
		parts_total_minor: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
		setup_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
		run_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
		created_at: now,
		updated_at: now
	});
	await q.addIndex('builds', ['publication', 'moderation', 'updated_at']);
	await q.addIndex('builds', ['owner_id', 'publication']);

	await q.createTable('setups', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		build_id: {
			type: DataTypes.INTEGER,
			allowNull: false,
			references: { model: 'builds', key: 'id' },
			onDelete: 'CASCADE'
		},
		position: { type: DataTypes.INTEGER, allowNull: false },
		change_note: { type: DataTypes.STRING(200), allowNull: false },
		is_stock: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
		config: { type: DataTypes.JSON, allowNull: false },
		version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
		exhaust_type: { type: DataTypes.STRING(20), allowNull: true },
		displacement_cc: real,
		carb_bore_mm: real,
		main_jet: real,
		final_drive_ratio: real,
		overall_ratio: real,
		tyre_circumference_mm: real,
		roller_total_g: real,
		sea_level_jet: real,
		gearing_limit_kmh: real,
		best_run_kmh: real,
		best_run_id: { type: DataTypes.INTEGER, allowNull: true },
		created_at: now,
		updated_at: now
	});
	await q.addIndex('setups', ['build_id', 'position'], { unique: true });

	await q.createTable('runs', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		setup_id: {
			type: DataTypes.INTEGER,
			allowNull: false,
			references: { model: 'setups', key: 'id' },
			onDelete: 'CASCADE'
		},
		build_id: {
			type: DataTypes.INTEGER,
			allowNull: false,
			references: { model: 'builds', key: 'id' },
			onDelete: 'CASCADE'
		},
		run_on: { type: DataTypes.DATEONLY, allowNull: false },
		speed_kmh: { type: DataTypes.DOUBLE, allowNull: false },
		method: {
			type: DataTypes.ENUM('gps-logger', 'phone-gps', 'radar', 'speedometer'),
			allowNull: false
		},
		two_way: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
		venue: { type: DataTypes.ENUM('closed-course', 'private-ground', 'other'), allowNull: false },
		elevation_m: { type: DataTypes.DOUBLE, allowNull: false },
		temp_c: { type: DataTypes.DOUBLE, allowNull: false },
		humidity_pct: { type: DataTypes.DOUBLE, allowNull: false },
		pressure_kpa: real,
		pressure_kind: {
			type: DataTypes.ENUM('sea-level', 'station'),
			allowNull: false,
			defaultValue: 'sea-level'
		},
		cht_cruise_c: real,
		cht_full_c: real,
		cht_sensor: {
			type: DataTypes.ENUM('plug-washer', 'head-stud', 'coolant'),
			allowNull: false,
			defaultValue: 'plug-washer'
		},
		rider_mass_kg: real,
		accel_seconds: real,
		accel_target_kmh: real,
		plug_reading: { type: DataTypes.STRING(20), allowNull: true },
		break_in: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
		heat_cycles: { type: DataTypes.INTEGER, allowNull: true },
		notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
		air_density: real,
		density_altitude_m: real,
		sea_level_jet: real,
		version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
		created_at: now,
		updated_at: now
	});
	await q.addIndex('runs', ['setup_id', 'speed_kmh']);
	await q.addIndex('runs', ['build_id']);

	await q.createTable('parts', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		build_id: {
			type: DataTypes.INTEGER,
			allowNull: false,
			references: { model: 'builds', key: 'id' },
			onDelete: 'CASCADE'
		},
		setup_id: {
			type: DataTypes.INTEGER,
			allowNull: true,
			references: { model: 'setups', key: 'id' },
			onDelete: 'SET NULL'
		},
		category: { type: DataTypes.STRING(20), allowNull: false },
		name: { type: DataTypes.STRING(160), allowNull: false },
		cost_minor: { type: DataTypes.INTEGER, allowNull: false },
		link: { type: DataTypes.STRING(500), allowNull: true },
		created_at: now
	});
	await q.addIndex('parts', ['build_id']);
};

export const down: Migration = async ({ context: q }) => {
	await q.dropTable('parts');
	await q.dropTable('runs');
	await q.dropTable('setups');
	await q.dropTable('builds');
};
