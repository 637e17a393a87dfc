import {
	DataTypes,
	Model,
	type CreationOptional,
	type InferAttributes,
	type InferCreationAttributes,
	type Sequelize
} from 'sequelize';

export class Part extends Model<InferAttributes<Part>, InferCreationAttributes<Part>> {
	declare id: CreationOptional<number>;
	declare buildId: number;
	declare setupId: number | null;
	declare category: string;
	declare name: string;
	/** Integer minor units (cents) of the build's currency. */
	declare costMinor: number;
	declare link: string | null;
	declare createdAt: CreationOptional<Date>;

	static setup(sequelize: Sequelize) {
		Part.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				buildId: { type: DataTypes.INTEGER, allowNull: false },
				setupId: DataTypes.INTEGER,
				category: { type: DataTypes.STRING(20), allowNull: false },
				name: { type: DataTypes.STRING(160), allowNull: false },
				costMinor: { type: DataTypes.INTEGER, allowNull: false },
				link: DataTypes.STRING(500),
				createdAt: DataTypes.DATE
			},
			{ sequelize, tableName: 'parts', underscored: true, updatedAt: false }
		);
	}
}
