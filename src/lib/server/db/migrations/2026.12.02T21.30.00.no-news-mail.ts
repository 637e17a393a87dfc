import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// There is no news mail: the choice promised something that was never sent, so it goes.
export const up: Migration = async ({ context: q }) => {
	await q.removeColumn('users', 'mail_news');
};

export const down: Migration = async ({ context: q }) => {
	await q.addColumn('users', 'mail_news', {
		type: DataTypes.BOOLEAN,
		allowNull: false,
		defaultValue: false
	});
};
