import { DataTypes, QueryTypes } from 'sequelize';
import { applyAppGrants } from '../grants';
import type { Migration } from '../migrator';

const userRef = (onDelete: 'CASCADE' | 'SET NULL', allowNull = onDelete === 'SET NULL') => ({
	type: DataTypes.UUID,
	allowNull,
	references: { model: 'users', key: 'id' },
	onDelete
});
const ref = (model: string) => ({
	type: DataTypes.INTEGER,
	allowNull: false,
	references: { model, key: 'id' },
	onDelete: 'CASCADE'
});
const stamps = {
	created_at: { type: DataTypes.DATE, allowNull: false },
	updated_at: { type: DataTypes.DATE, allowNull: false }
};

/** The name MariaDB gave the foreign key from builds.owner_id, so it can be replaced. */
async function ownerKeyName(q: Parameters<Migration>[0]['context']): Promise<string | null> {
	const rows = await q.sequelize.query<{ name: string }>(
		`SELECT CONSTRAINT_NAME AS name FROM information_schema.KEY_COLUMN_USAGE
		 WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'builds' AND COLUMN_NAME = 'owner_id'
		   AND REFERENCED_TABLE_NAME = 'users'`,
		{ type: QueryTypes.SELECT }
	);
	return rows[0]?.name ?? null;
}

export const up: Migration = async ({ context: q }) => {
	await q.createTable('shops', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		// One shop page per shop account.
		owner_id: { ...userRef('CASCADE'), unique: true },
		name: { type: DataTypes.STRING(120), allowNull: false },
		region: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
		services: { type: DataTypes.TEXT, allowNull: false },
		opening_note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
		logo_key: { type: DataTypes.STRING(300), allowNull: true },
		verified_at: { type: DataTypes.DATE, allowNull: true },
		moderation: {
			type: DataTypes.ENUM('visible', 'hidden'),
			allowNull: false,
			defaultValue: 'visible'
		},
		hidden_reason: { type: DataTypes.STRING(500), allowNull: true },
		...stamps
	});
	await q.addIndex('shops', ['verified_at']);

	await q.createTable('shop_staff', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		shop_id: ref('shops'),
		email: { type: DataTypes.STRING(254), allowNull: false },
		user_id: userRef('CASCADE', true),
		accepted_at: { type: DataTypes.DATE, allowNull: true },
		...stamps
	});
	await q.addIndex('shop_staff', ['shop_id', 'email'], { unique: true });
	await q.addIndex('shop_staff', ['user_id']);

	await q.createTable('shop_links', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		build_id: ref('builds'),
		shop_id: ref('shops'),
		kind: { type: DataTypes.ENUM('built', 'tuned'), allowNull: false },
		state: {
			type: DataTypes.ENUM('requested', 'approved', 'declined', 'unlinked'),
			allowNull: false
		},
		note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
		requested_by: userRef('SET NULL'),
		decided_at: { type: DataTypes.DATE, allowNull: true },
		...stamps
	});
	await q.addIndex('shop_links', ['build_id', 'state']);
	await q.addIndex('shop_links', ['shop_id', 'state']);

	await q.createTable('build_transfers', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		build_id: ref('builds'),
		shop_id: ref('shops'),
		to_email: { type: DataTypes.STRING(254), allowNull: false },
		state: {
			type: DataTypes.ENUM('pending', 'accepted', 'cancelled'),
			allowNull: false
		},
		decided_at: { type: DataTypes.DATE, allowNull: true },
		...stamps
	});
	await q.addIndex('build_transfers', ['build_id', 'state']);
	await q.addIndex('build_transfers', ['to_email', 'state']);

	await q.createTable('shop_messages', {
		id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
		shop_id: ref('shops'),
		sender_id: userRef('CASCADE', false),
		body: { type: DataTypes.TEXT, allowNull: false },
		reply: { type: DataTypes.TEXT, allowNull: true },
		replied_at: { type: DataTypes.DATE, allowNull: true },
		replied_by: userRef('SET NULL'),
		...stamps
	});
	await q.addIndex('shop_messages', ['shop_id', 'created_at']);

	// A build kept after its owner deleted their account has no owner: the FK sets NULL.
	const key = await ownerKeyName(q);
	if (key) await q.removeConstraint('builds', key);
	await q.changeColumn('builds', 'owner_id', { type: DataTypes.UUID, allowNull: true });
	await q.addConstraint('builds', {
		type: 'foreign key',
		name: 'builds_owner_fk',
		fields: ['owner_id'],
		references: { table: 'users', field: 'id' },
		onDelete: 'SET NULL',
		onUpdate: 'CASCADE'
	});

	await applyAppGrants(q);
};

export const down: Migration = async ({ context: q }) => {
	await q.removeConstraint('builds', 'builds_owner_fk');
	await q.sequelize.query('DELETE FROM builds WHERE owner_id IS NULL');
	await q.changeColumn('builds', 'owner_id', { type: DataTypes.UUID, allowNull: false });
	await q.addConstraint('builds', {
		type: 'foreign key',
		name: 'builds_owner_fk',
		fields: ['owner_id'],
		references: { table: 'users', field: 'id' },
		onDelete: 'CASCADE',
		onUpdate: 'CASCADE'
	});
	for (const t of ['shop_messages', 'build_transfers', 'shop_links', 'shop_staff', 'shops'])
		await q.dropTable(t);
};
