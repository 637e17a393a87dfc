import { DataTypes } from 'sequelize';
import { applyAppGrants } from '../grants';
import type { Migration } from '../migrator';

// The answers to JSON creates sent with an Idempotency-Key, so a retried create makes nothing new.
export const up: Migration = async ({ context: q }) => {
	await q.createTable('idempotency_keys', {
		id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
		user_id: {
			type: DataTypes.UUID,
			allowNull: false,
			references: { model: 'users', key: 'id' },
			onDelete: 'CASCADE'
		},
		idem_key: { type: DataTypes.STRING(200), allowNull: false },
		fingerprint: { type: DataTypes.CHAR(64), allowNull: false },
		status: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
		body: { type: DataTypes.TEXT, allowNull: true },
		created_at: { type: DataTypes.DATE, allowNull: false }
	});
	await q.addIndex('idempotency_keys', ['user_id', 'idem_key'], {
		name: 'idempotency_keys_user_key',
		unique: true
	});
	await q.addIndex('idempotency_keys', ['created_at'], { name: 'idempotency_keys_age' });
	await applyAppGrants(q);
};

export const down: Migration = async ({ context: q }) => {
	await q.dropTable('idempotency_keys');
};
