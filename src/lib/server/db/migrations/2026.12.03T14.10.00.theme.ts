import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// A member's choice of light or dark pages, or the device's own; kept with the account so every
// phone and computer they sign in on shows the same.
export const up: Migration = async ({ context: q }) => {
	await q.addColumn('users', 'theme', {
		type: DataTypes.ENUM('device', 'light', 'dark'),
		allowNull: false,
		defaultValue: 'device'
	});
};

export const down: Migration = async ({ context: q }) => {
	await q.removeColumn('users', 'theme');
};
