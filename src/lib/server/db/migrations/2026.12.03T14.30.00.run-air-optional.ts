import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// A run can be logged at the track with just its speed, method and date, and the place and air
// added later: those columns may be empty ("not recorded"). Nothing stored changes.
const real = DataTypes.DOUBLE;

export const up: Migration = async ({ context: q }) => {
	await q.changeColumn('runs', 'elevation_m', { type: real, allowNull: true });
	await q.changeColumn('runs', 'temp_c', { type: real, allowNull: true });
	await q.changeColumn('runs', 'humidity_pct', { type: real, allowNull: true });
	await q.changeColumn('runs', 'venue', {
		type: DataTypes.ENUM('closed-course', 'private-ground', 'other'),
		allowNull: true
	});
};

export const down: Migration = async ({ context: q }) => {
	for (const col of ['elevation_m', 'temp_c', 'humidity_pct'])
		await q.changeColumn('runs', col, { type: real, allowNull: false });
	await q.changeColumn('runs', 'venue', {
		type: DataTypes.ENUM('closed-course', 'private-ground', 'other'),
		allowNull: false
	});
};
