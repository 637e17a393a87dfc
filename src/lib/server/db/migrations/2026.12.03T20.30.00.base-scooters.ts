import { DataTypes } from 'sequelize';
import { applyAppGrants } from '../grants';
import type { Migration } from '../migrator';

// The catalogue of stock scooters: engine families (shared by several scooters) and base scooters
// with their factory drivetrain, so a build names the scooter it started from instead of typing it.
const stamps = {
	created_at: { type: DataTypes.DATE, allowNull: false },
	updated_at: { type: DataTypes.DATE, allowNull: false }
};
const real = (allowNull = true) => ({ type: DataTypes.DOUBLE, allowNull });
const small = (allowNull = true) => ({ type: DataTypes.SMALLINT, allowNull });

export const up: Migration = async ({ context: q }) => {
	await q.createTable('engine_families', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		name: { type: DataTypes.STRING(80), allowNull: false, unique: true },
		engine_cycle: { type: DataTypes.ENUM('two-stroke', 'four-stroke'), allowNull: false },
		cooling: { type: DataTypes.ENUM('air', 'liquid'), allowNull: false },
		cylinder_orientation: { type: DataTypes.ENUM('horizontal', 'vertical'), allowNull: false },
		bore_mm: real(false),
		stroke_mm: real(false),
		...stamps
	});
	await q.createTable('base_scooters', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		maker: { type: DataTypes.STRING(60), allowNull: false },
		model: { type: DataTypes.STRING(80), allowNull: false },
		year_from: small(false),
		year_to: small(),
		engine_family_id: {
			type: DataTypes.INTEGER,
			allowNull: false,
			references: { model: 'engine_families', key: 'id' },
			onDelete: 'RESTRICT'
		},
		carb_bore_mm: real(),
		primary_driver: small(),
		primary_driven: small(),
		secondary_driver: small(),
		secondary_driven: small(),
		cvt_low_ratio: real(),
		cvt_top_ratio: real(),
		roller_count: small(),
		roller_weight_g: real(),
		rear_tyre: { type: DataTypes.STRING(30), allowNull: false, defaultValue: '' },
		restrictors: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
		peak_rpm: small(),
		stock_speed_kmh: real(),
		stock_speed_source: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
		// listed: in the public catalogue; proposed: usable by its proposer, waiting for the desk.
		state: {
			type: DataTypes.ENUM('listed', 'proposed', 'declined'),
			allowNull: false,
			defaultValue: 'listed'
		},
		proposed_by: {
			type: DataTypes.UUID,
			allowNull: true,
			references: { model: 'users', key: 'id' },
			onDelete: 'SET NULL'
		},
		...stamps
	});
	await q.addIndex('base_scooters', ['maker', 'model', 'year_from'], {
		unique: true,
		name: 'base_scooters_name'
	});
	await q.addIndex('base_scooters', ['state', 'engine_family_id']);
	await q.addColumn('builds', 'base_scooter_id', {
		type: DataTypes.INTEGER,
		allowNull: true,
		references: { model: 'base_scooters', key: 'id' },
		onDelete: 'SET NULL'
	});
	// A scooter's page lists its published builds, newest first.
	await q.addIndex('builds', ['base_scooter_id', 'publication', 'moderation', 'id'], {
		name: 'builds_by_scooter'
	});
	await applyAppGrants(q);
};

export const down: Migration = async ({ context: q }) => {
	await q.removeIndex('builds', 'builds_by_scooter');
	await q.removeColumn('builds', 'base_scooter_id');
	await q.dropTable('base_scooters');
	await q.dropTable('engine_families');
};
