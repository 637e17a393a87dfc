import { DataTypes } from 'sequelize';
import { applyAppGrants } from '../grants';
import type { Migration } from '../migrator';

const ITEM_TYPES = ['build', 'setup', 'comment', 'shop'];
const moderationState = {
	type: DataTypes.ENUM('visible', 'hidden'),
	allowNull: false,
	defaultValue: 'visible'
};
const openFlag = "TINYINT AS (IF(status = 'open', 1, NULL)) PERSISTENT";

export const up: Migration = async ({ context: q }) => {
	await q.addColumn('users', 'suspended_until', { type: DataTypes.DATE, allowNull: true });
	await q.addColumn('setups', 'moderation', moderationState);
	await q.addColumn('setups', 'hidden_reason', { type: DataTypes.STRING(500), allowNull: true });
	await q.addColumn('builds', 'comments_mailed_at', { type: DataTypes.DATE, allowNull: true });

	await q.createTable('comments', {
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
		parent_id: {
			type: DataTypes.INTEGER,
			allowNull: true,
			references: { model: 'comments', key: 'id' },
			onDelete: 'CASCADE'
		},
		// NULL once the author's account is gone and the comment was kept.
		author_id: {
			type: DataTypes.UUID,
			allowNull: true,
			references: { model: 'users', key: 'id' },
			onDelete: 'SET NULL'
		},
		body: { type: DataTypes.TEXT, allowNull: false },
		moderation: moderationState,
		hidden_reason: { type: DataTypes.STRING(500), allowNull: true },
		deleted_at: DataTypes.DATE,
		edited_at: DataTypes.DATE,
		notified_at: DataTypes.DATE,
		created_at: { type: DataTypes.DATE, allowNull: false },
		updated_at: { type: DataTypes.DATE, allowNull: false }
	});
	await q.addIndex('comments', ['build_id', 'created_at']);
	await q.addIndex('comments', ['notified_at', 'build_id'], { name: 'comments_digest' });

	await q.createTable('reports', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		item_type: { type: DataTypes.ENUM(...ITEM_TYPES), allowNull: false },
		item_id: { type: DataTypes.INTEGER, allowNull: false },
		reporter_id: {
			type: DataTypes.UUID,
			allowNull: false,
			references: { model: 'users', key: 'id' },
			onDelete: 'CASCADE'
		},
		reason: {
			type: DataTypes.ENUM('unsafe', 'wrong-data', 'spam', 'abuse', 'other'),
			allowNull: false
		},
		note: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: '' },
		status: { type: DataTypes.ENUM('open', 'closed'), allowNull: false, defaultValue: 'open' },
		created_at: { type: DataTypes.DATE, allowNull: false },
		closed_at: DataTypes.DATE
	});
	await q.createTable('flags', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		item_type: { type: DataTypes.ENUM(...ITEM_TYPES), allowNull: false },
		item_id: { type: DataTypes.INTEGER, allowNull: false },
		code: { type: DataTypes.STRING(60), allowNull: false },
		detail: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
		status: { type: DataTypes.ENUM('open', 'closed'), allowNull: false, defaultValue: 'open' },
		created_at: { type: DataTypes.DATE, allowNull: false },
		closed_at: DataTypes.DATE
	});
	// One open report per person per item, and one open flag per rule per item, kept by the
	// database: the generated column is 1 while open and NULL after, and NULLs never collide.
	for (const t of ['reports', 'flags']) {
		await q.sequelize.query(`ALTER TABLE ${t} ADD COLUMN open_key ${openFlag}`);
	}
	await q.addIndex('reports', ['item_type', 'item_id', 'reporter_id', 'open_key'], {
		unique: true,
		name: 'reports_one_open'
	});
	await q.addIndex('flags', ['item_type', 'item_id', 'code', 'open_key'], {
		unique: true,
		name: 'flags_one_open'
	});

	await q.createTable('review_cases', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		item_type: { type: DataTypes.ENUM(...ITEM_TYPES), allowNull: false },
		item_id: { type: DataTypes.INTEGER, allowNull: false },
		author_id: { type: DataTypes.UUID, allowNull: true },
		// On the desk's list until decided; a report, a flag or a second-look request reopens it.
		on_desk: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
		concern: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
		caution: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
		second_look: {
			type: DataTypes.ENUM('none', 'asked', 'used'),
			allowNull: false,
			defaultValue: 'none'
		},
		opened_at: { type: DataTypes.DATE, allowNull: false },
		updated_at: { type: DataTypes.DATE, allowNull: false }
	});
	await q.addIndex('review_cases', ['item_type', 'item_id'], { unique: true });
	await q.addIndex('review_cases', ['on_desk', 'opened_at']);
	await q.addIndex('review_cases', ['author_id']);

	// No foreign keys: the log outlives the accounts and items it names.
	await q.createTable('moderation_log', {
		id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
		at: { type: DataTypes.DATE(3), allowNull: false },
		actor_id: { type: DataTypes.UUID, allowNull: true },
		action: { type: DataTypes.STRING(40), allowNull: false },
		item_type: { type: DataTypes.STRING(20), allowNull: true },
		item_id: { type: DataTypes.INTEGER, allowNull: true },
		subject_id: { type: DataTypes.UUID, allowNull: true },
		reason: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: '' },
		detail: { type: DataTypes.JSON, allowNull: true }
	});
	await q.addIndex('moderation_log', ['at']);
	await q.addIndex('moderation_log', ['subject_id', 'at']);
	await q.addIndex('moderation_log', ['item_type', 'item_id', 'at']);

	await applyAppGrants(q);
};

export const down: Migration = async ({ context: q }) => {
	for (const t of ['moderation_log', 'review_cases', 'flags', 'reports', 'comments'])
		await q.dropTable(t);
	await q.removeColumn('builds', 'comments_mailed_at');
	await q.removeColumn('setups', 'hidden_reason');
	await q.removeColumn('setups', 'moderation');
	await q.removeColumn('users', 'suspended_until');
};
