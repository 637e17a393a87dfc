import {
	DataTypes,
	Model,
	type CreationOptional,
	type InferAttributes,
	type InferCreationAttributes,
	type NonAttribute,
	type Sequelize
} from 'sequelize';

const stamps = { createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE };
const options = (sequelize: Sequelize, tableName: string) => ({
	sequelize,
	tableName,
	underscored: true
});

/** An engine as the factory built it, shared by the scooters that carry it. */
export class EngineFamily extends Model<
	InferAttributes<EngineFamily>,
	InferCreationAttributes<EngineFamily>
> {
	declare id: CreationOptional<number>;
	declare name: string;
	declare engineCycle: 'two-stroke' | 'four-stroke';
	declare cooling: 'air' | 'liquid';
	declare cylinderOrientation: 'horizontal' | 'vertical';
	declare boreMm: number;
	declare strokeMm: number;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;

	static setup(sequelize: Sequelize) {
		EngineFamily.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				name: { type: DataTypes.STRING(80), allowNull: false },
				engineCycle: { type: DataTypes.ENUM('two-stroke', 'four-stroke'), allowNull: false },
				cooling: { type: DataTypes.ENUM('air', 'liquid'), allowNull: false },
				cylinderOrientation: {
					type: DataTypes.ENUM('horizontal', 'vertical'),
					allowNull: false
				},
				boreMm: { type: DataTypes.DOUBLE, allowNull: false },
				strokeMm: { type: DataTypes.DOUBLE, allowNull: false },
				...stamps
			},
			options(sequelize, 'engine_families')
		);
	}
}

/** A stock scooter with its factory drivetrain; members start build sheets from one. */
export class BaseScooter extends Model<
	InferAttributes<BaseScooter>,
	InferCreationAttributes<BaseScooter>
> {
	declare id: CreationOptional<number>;
	declare maker: string;
	declare model: string;
	declare yearFrom: number;
	declare yearTo: CreationOptional<number | null>;
	declare engineFamilyId: number;
	declare carbBoreMm: CreationOptional<number | null>;
	declare primaryDriver: CreationOptional<number | null>;
	declare primaryDriven: CreationOptional<number | null>;
	declare secondaryDriver: CreationOptional<number | null>;
	declare secondaryDriven: CreationOptional<number | null>;
	declare cvtLowRatio: CreationOptional<number | null>;
	declare cvtTopRatio: CreationOptional<number | null>;
	declare rollerCount: CreationOptional<number | null>;
	declare rollerWeightG: CreationOptional<number | null>;
	declare rearTyre: CreationOptional<string>;
	declare restrictors: CreationOptional<string>;
	declare peakRpm: CreationOptional<number | null>;
	declare stockSpeedKmh: CreationOptional<number | null>;
	declare stockSpeedSource: CreationOptional<string>;
	declare state: CreationOptional<'listed' | 'proposed' | 'declined'>;
	declare proposedBy: CreationOptional<string | null>;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;
	declare family?: NonAttribute<EngineFamily>;

	static setup(sequelize: Sequelize) {
		const small = DataTypes.SMALLINT;
		BaseScooter.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				maker: { type: DataTypes.STRING(60), allowNull: false },
				model: { type: DataTypes.STRING(80), allowNull: false },
				yearFrom: { type: small, allowNull: false },
				yearTo: small,
				engineFamilyId: { type: DataTypes.INTEGER, allowNull: false },
				carbBoreMm: DataTypes.DOUBLE,
				primaryDriver: small,
				primaryDriven: small,
				secondaryDriver: small,
				secondaryDriven: small,
				cvtLowRatio: DataTypes.DOUBLE,
				cvtTopRatio: DataTypes.DOUBLE,
				rollerCount: small,
				rollerWeightG: DataTypes.DOUBLE,
				rearTyre: { type: DataTypes.STRING(30), allowNull: false, defaultValue: '' },
				restrictors: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
				peakRpm: small,
				stockSpeedKmh: DataTypes.DOUBLE,
				stockSpeedSource: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
				state: {
					type: DataTypes.ENUM('listed', 'proposed', 'declined'),
					allowNull: false,
					defaultValue: 'listed'
				},
				proposedBy: DataTypes.UUID,
				...stamps
			},
			options(sequelize, 'base_scooters')
		);
	}
}
