import {
	DataTypes,
	Model,
	type CreationOptional,
	type InferAttributes,
	type InferCreationAttributes,
	type Sequelize
} from 'sequelize';

export class Run extends Model<InferAttributes<Run>, InferCreationAttributes<Run>> {
	declare id: CreationOptional<number>;
	declare setupId: number;
	declare buildId: number;
	declare runOn: string;
	declare speedKmh: number;
	declare method: 'gps-logger' | 'phone-gps' | 'radar' | 'speedometer';
	declare twoWay: boolean;
	/** Place and air may wait to be added later (null: not recorded). */
	declare venue: 'closed-course' | 'private-ground' | 'other' | null;
	declare elevationM: number | null;
	declare tempC: number | null;
	declare humidityPct: number | null;
	declare pressureKpa: number | null;
	declare pressureKind: 'sea-level' | 'station';
	declare chtCruiseC: number | null;
	declare chtFullC: number | null;
	declare chtSensor: 'plug-washer' | 'head-stud' | 'coolant';
	declare riderMassKg: number | null;
	declare accelSeconds: number | null;
	declare accelTargetKmh: number | null;
	declare plugReading: string | null;
	declare breakIn: boolean;
	declare heatCycles: number | null;
	declare notes: string;
	declare airDensity: CreationOptional<number | null>;
	declare densityAltitudeM: CreationOptional<number | null>;
	declare seaLevelJet: CreationOptional<number | null>;
	declare version: CreationOptional<number>;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;

	static setup(sequelize: Sequelize) {
		const real = DataTypes.DOUBLE;
		Run.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				setupId: { type: DataTypes.INTEGER, allowNull: false },
				buildId: { type: DataTypes.INTEGER, allowNull: false },
				runOn: { type: DataTypes.DATEONLY, allowNull: false },
				speedKmh: { type: real, allowNull: false },
				method: {
					type: DataTypes.ENUM('gps-logger', 'phone-gps', 'radar', 'speedometer'),
					allowNull: false
				},
				twoWay: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
				venue: DataTypes.ENUM('closed-course', 'private-ground', 'other'),
				elevationM: real,
				tempC: real,
				humidityPct: real,
				pressureKpa: real,
				pressureKind: {
					type: DataTypes.ENUM('sea-level', 'station'),
					allowNull: false,
					defaultValue: 'sea-level'
				},
				chtCruiseC: real,
				chtFullC: real,
				chtSensor: {
					type: DataTypes.ENUM('plug-washer', 'head-stud', 'coolant'),
					allowNull: false,
					defaultValue: 'plug-washer'
				},
				riderMassKg: real,
				accelSeconds: real,
				accelTargetKmh: real,
				plugReading: DataTypes.STRING(20),
				breakIn: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
				heatCycles: DataTypes.INTEGER,
				notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
				airDensity: real,
				densityAltitudeM: real,
				seaLevelJet: real,
				version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
				createdAt: DataTypes.DATE,
				updatedAt: DataTypes.DATE
			},
			{ sequelize, tableName: 'runs', underscored: true }
		);
	}
}
