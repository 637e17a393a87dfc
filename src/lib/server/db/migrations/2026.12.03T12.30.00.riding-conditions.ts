import { DataTypes } from 'sequelize';
import { applyAppGrants } from '../grants';
import type { Migration } from '../migrator';

// A member's named riding conditions for the retune ("home, summer", "the coast track"): kept
// per account, gone with it.
export const up: Migration = async ({ context: q }) => {
	await q.createTable('riding_conditions', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		user_id: {
			type: DataTypes.UUID,
			allowNull: false,
			references: { model: 'users', key: 'id' },
			onDelete: 'CASCADE'
		},
		name: { type: DataTypes.STRING(60), allowNull: false },
		elevation_m: { type: DataTypes.DOUBLE, allowNull: false },
		temp_c: { type: DataTypes.DOUBLE, allowNull: false },
		humidity_pct: { type: DataTypes.DOUBLE, allowNull: false },
		pressure_kpa: { type: DataTypes.DOUBLE, allowNull: true },
		pressure_kind: { type: DataTypes.ENUM('sea-level', 'station'), allowNull: false },
		created_at: { type: DataTypes.DATE, allowNull: false },
		updated_at: { type: DataTypes.DATE, allowNull: false }
	});
	await q.addIndex('riding_conditions', ['user_id', 'name'], {
		name: 'riding_conditions_user_name',
		unique: true
	});
	await applyAppGrants(q);
};

export const down: Migration = async ({ context: q }) => {
	await q.dropTable('riding_conditions');
};
