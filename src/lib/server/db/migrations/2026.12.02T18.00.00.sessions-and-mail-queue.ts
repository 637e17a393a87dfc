import { DataTypes } from 'sequelize';
import { applyAppGrants } from '../grants';
import type { Migration } from '../migrator';

export const up: Migration = async ({ context: q }) => {
	// A session carries the generation it was issued in; bumping it ends every older session.
	await q.addColumn('users', 'session_generation', {
		type: DataTypes.INTEGER.UNSIGNED,
		allowNull: false,
		defaultValue: 0
	});
	// Sessions ended by signing out, kept until the token would have expired anyway.
	await q.createTable('revoked_sessions', {
		sid: { type: DataTypes.CHAR(36), primaryKey: true },
		expires_at: { type: DataTypes.DATE, allowNull: false }
	});
	await q.addIndex('revoked_sessions', ['expires_at']);
	// Every mail goes through here: the request that asked for it answers at once, and a sweep
	// sends it, retrying with backoff while the relay is down.
	await q.createTable('mail_queue', {
		id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
		to_address: { type: DataTypes.STRING(254), allowNull: false },
		letter: { type: DataTypes.TEXT('medium'), allowNull: false },
		attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
		next_attempt_at: { type: DataTypes.DATE, allowNull: false },
		claimed_by: { type: DataTypes.STRING(64), allowNull: true },
		claimed_until: { type: DataTypes.DATE, allowNull: true },
		sent_at: { type: DataTypes.DATE, allowNull: true },
		failed_at: { type: DataTypes.DATE, allowNull: true },
		last_error: { type: DataTypes.STRING(500), allowNull: true },
		created_at: { type: DataTypes.DATE, allowNull: false }
	});
	await q.addIndex('mail_queue', ['sent_at', 'failed_at', 'next_attempt_at'], {
		name: 'mail_queue_due'
	});
	await applyAppGrants(q);
};

export const down: Migration = async ({ context: q }) => {
	await q.dropTable('mail_queue');
	await q.dropTable('revoked_sessions');
	await q.removeColumn('users', 'session_generation');
};
