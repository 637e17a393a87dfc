import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// Photo rows point at objects in the store under keys the app makes; the bytes never touch MariaDB.
export const up: Migration = async ({ context: q }) => {
	await q.createTable('photos', {
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
		position: { type: DataTypes.INTEGER, allowNull: false },
		caption: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
		display_key: { type: DataTypes.STRING(200), allowNull: false },
		thumb_key: { type: DataTypes.STRING(200), allowNull: false },
		width: { type: DataTypes.INTEGER, allowNull: false },
		height: { type: DataTypes.INTEGER, allowNull: false },
		source_format: { type: DataTypes.STRING(10), allowNull: false },
		created_at: { type: DataTypes.DATE, allowNull: false }
	});
	await q.addIndex('photos', ['build_id', 'position']);
};

export const down: Migration = async ({ context: q }) => {
	await q.dropTable('photos');
};
