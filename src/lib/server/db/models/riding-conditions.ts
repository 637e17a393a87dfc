import {
	DataTypes,
	Model,
	type CreationOptional,
	type InferAttributes,
	type InferCreationAttributes,
	type Sequelize
} from 'sequelize';

/** A member's own named riding conditions (a place and its usual weather), for the retune. */
export class RidingConditions extends Model<
	InferAttributes<RidingConditions>,
	InferCreationAttributes<RidingConditions>
> {
	declare id: CreationOptional<number>;
	declare userId: string;
	declare name: string;
	declare elevationM: number;
	declare tempC: number;
	declare humidityPct: number;
	declare pressureKpa: number | null;
	declare pressureKind: 'sea-level' | 'station';
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;

	static setup(sequelize: Sequelize) {
		RidingConditions.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				userId: { type: DataTypes.UUID, allowNull: false },
				name: { type: DataTypes.STRING(60), allowNull: false },
				elevationM: { type: DataTypes.DOUBLE, allowNull: false },
				tempC: { type: DataTypes.DOUBLE, allowNull: false },
				humidityPct: { type: DataTypes.DOUBLE, allowNull: false },
				pressureKpa: { type: DataTypes.DOUBLE, allowNull: true },
				pressureKind: { type: DataTypes.ENUM('sea-level', 'station'), allowNull: false },
				createdAt: DataTypes.DATE,
				updatedAt: DataTypes.DATE
			},
			{ sequelize, tableName: 'riding_conditions', underscored: true }
		);
	}
}
