import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// Users plus the three tables @auth/sequelize-adapter uses (underscored column names).
export const up: Migration = async ({ context: q }) => {
	const now = { type: DataTypes.DATE, allowNull: false };
	await q.createTable('users', {
		id: { type: DataTypes.UUID, primaryKey: true },
		name: DataTypes.STRING(80),
		email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
		email_verified: DataTypes.DATE,
		image: DataTypes.STRING(500),
		password_hash: DataTypes.STRING(255),
		role: {
			type: DataTypes.ENUM('member', 'moderator', 'shop', 'admin'),
			allowNull: false,
			defaultValue: 'member'
		},
		suspended_at: DataTypes.DATE,
		suspended_reason: DataTypes.STRING(500),
		units: { type: DataTypes.ENUM('metric', 'imperial'), allowNull: false, defaultValue: 'metric' },
		mail_comments: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
		mail_shop: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
		mail_news: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
		created_at: now,
		updated_at: now
	});
	await q.addIndex('users', ['role']);

	const userRef = {
		type: DataTypes.UUID,
		allowNull: false,
		references: { model: 'users', key: 'id' },
		onDelete: 'CASCADE'
	};
	await q.createTable('accounts', {
		id: { type: DataTypes.UUID, primaryKey: true },
		type: { type: DataTypes.STRING, allowNull: false },
		provider: { type: DataTypes.STRING, allowNull: false },
		provider_account_id: { type: DataTypes.STRING, allowNull: false },
		refresh_token: DataTypes.TEXT,
		access_token: DataTypes.TEXT,
		expires_at: DataTypes.INTEGER,
		token_type: DataTypes.STRING,
		scope: DataTypes.STRING,
		id_token: DataTypes.TEXT,
		session_state: DataTypes.STRING,
		user_id: userRef
	});
	await q.addIndex('accounts', ['provider', 'provider_account_id'], { unique: true });
	await q.createTable('sessions', {
		id: { type: DataTypes.UUID, primaryKey: true },
		expires: { type: DataTypes.DATE, allowNull: false },
		session_token: { type: DataTypes.STRING, allowNull: false, unique: true },
		user_id: userRef
	});
	await q.createTable('verification_tokens', {
		token: { type: DataTypes.STRING, primaryKey: true },
		identifier: { type: DataTypes.STRING, allowNull: false },
		expires: { type: DataTypes.DATE, allowNull: false }
	});
};

export const down: Migration = async ({ context: q }) => {
	await q.dropTable('verification_tokens');
	await q.dropTable('sessions');
	await q.dropTable('accounts');
	await q.dropTable('users');
};
