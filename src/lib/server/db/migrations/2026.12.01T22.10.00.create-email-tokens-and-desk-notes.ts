import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

export const up: Migration = async ({ context: q }) => {
	const userRef = (onDelete: string) => ({
		type: DataTypes.UUID,
		allowNull: false,
		references: { model: 'users', key: 'id' },
		onDelete
	});
	await q.createTable('email_tokens', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		user_id: userRef('CASCADE'),
		purpose: { type: DataTypes.ENUM('verify', 'reset'), allowNull: false },
		token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
		expires_at: { type: DataTypes.DATE, allowNull: false },
		used_at: DataTypes.DATE,
		created_at: { type: DataTypes.DATE, allowNull: false }
	});
	await q.createTable('desk_notes', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		author_id: userRef('CASCADE'),
		body: { type: DataTypes.STRING(1000), allowNull: false },
		created_at: { type: DataTypes.DATE, allowNull: false }
	});
	await q.addIndex('desk_notes', ['created_at']);
};

export const down: Migration = async ({ context: q }) => {
	await q.dropTable('desk_notes');
	await q.dropTable('email_tokens');
};
