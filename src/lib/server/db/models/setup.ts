import {
	DataTypes,
	Model,
	type CreationOptional,
	type InferAttributes,
	type InferCreationAttributes,
	type Sequelize
} from 'sequelize';

export type SetupConfig = Record<string, string | number | boolean | null>;

export class Setup extends Model<InferAttributes<Setup>, InferCreationAttributes<Setup>> {
	declare id: CreationOptional<number>;
	declare buildId: number;
	declare position: number;
	declare changeNote: string;
	declare isStock: CreationOptional<boolean>;
	declare config: SetupConfig;
	declare version: CreationOptional<number>;
	declare exhaustType: CreationOptional<string | null>;
	declare displacementCc: CreationOptional<number | null>;
	declare carbBoreMm: CreationOptional<number | null>;
	declare mainJet: CreationOptional<number | null>;
	declare finalDriveRatio: CreationOptional<number | null>;
	declare overallRatio: CreationOptional<number | null>;
	declare tyreCircumferenceMm: CreationOptional<number | null>;
	declare rollerTotalG: CreationOptional<number | null>;
	declare seaLevelJet: CreationOptional<number | null>;
	declare gearingLimitKmh: CreationOptional<number | null>;
	declare bestRunKmh: CreationOptional<number | null>;
	declare bestRunId: CreationOptional<number | null>;
	declare bestRunElevationM: CreationOptional<number | null>;
	declare bestRunMethod: CreationOptional<string | null>;
	declare engineCycle: CreationOptional<'two-stroke' | 'four-stroke'>;
	declare listed: CreationOptional<boolean>;
	declare anyListed: CreationOptional<boolean>;
	declare prevSetupId: CreationOptional<number | null>;
	declare changeKind: CreationOptional<string | null>;
	declare effectKmh: CreationOptional<number | null>;
	declare bestRunDensity: CreationOptional<number | null>;
	declare bestRunTwoWay: CreationOptional<boolean | null>;
	declare bestRunVenue: CreationOptional<string | null>;
	declare engineFamily: CreationOptional<string>;
	declare moderation: CreationOptional<'visible' | 'hidden'>;
	declare hiddenReason: CreationOptional<string | null>;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;

	static setup(sequelize: Sequelize) {
		const real = DataTypes.DOUBLE;
		Setup.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				buildId: { type: DataTypes.INTEGER, allowNull: false },
				position: { type: DataTypes.INTEGER, allowNull: false },
				changeNote: { type: DataTypes.STRING(200), allowNull: false },
				isStock: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
				config: {
					type: DataTypes.JSON,
					allowNull: false,
					// MariaDB keeps JSON as LONGTEXT; the driver may hand it back as a string.
					get() {
						const raw = this.getDataValue('config') as unknown;
						return (typeof raw === 'string' ? JSON.parse(raw) : raw) as SetupConfig;
					}
				},
				version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
				exhaustType: DataTypes.STRING(20),
				displacementCc: real,
				carbBoreMm: real,
				mainJet: real,
				finalDriveRatio: real,
				overallRatio: real,
				tyreCircumferenceMm: real,
				rollerTotalG: real,
				seaLevelJet: real,
				gearingLimitKmh: real,
				bestRunKmh: real,
				bestRunId: DataTypes.INTEGER,
				bestRunElevationM: real,
				bestRunMethod: DataTypes.STRING(20),
				engineCycle: {
					type: DataTypes.ENUM('two-stroke', 'four-stroke'),
					allowNull: false,
					defaultValue: 'two-stroke'
				},
				listed: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
				anyListed: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
				prevSetupId: DataTypes.INTEGER,
				changeKind: DataTypes.STRING(20),
				effectKmh: real,
				bestRunDensity: real,
				bestRunTwoWay: DataTypes.BOOLEAN,
				bestRunVenue: DataTypes.STRING(20),
				engineFamily: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
				moderation: {
					type: DataTypes.ENUM('visible', 'hidden'),
					allowNull: false,
					defaultValue: 'visible'
				},
				hiddenReason: DataTypes.STRING(500),
				createdAt: DataTypes.DATE,
				updatedAt: DataTypes.DATE
			},
			{ sequelize, tableName: 'setups', underscored: true }
		);
	}
}
