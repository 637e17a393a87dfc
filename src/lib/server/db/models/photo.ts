import {
	DataTypes,
	Model,
	type CreationOptional,
	type InferAttributes,
	type InferCreationAttributes,
	type Sequelize
} from 'sequelize';

export class Photo extends Model<InferAttributes<Photo>, InferCreationAttributes<Photo>> {
	declare id: CreationOptional<number>;
	declare buildId: number;
	declare setupId: number | null;
	declare position: number;
	declare caption: string;
	declare displayKey: string;
	declare thumbKey: string;
	declare width: number;
	declare height: number;
	declare sourceFormat: string;
	declare createdAt: CreationOptional<Date>;

	static setup(sequelize: Sequelize) {
		Photo.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				buildId: { type: DataTypes.INTEGER, allowNull: false },
				setupId: DataTypes.INTEGER,
				position: { type: DataTypes.INTEGER, allowNull: false },
				caption: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
				displayKey: { type: DataTypes.STRING(200), allowNull: false },
				thumbKey: { type: DataTypes.STRING(200), allowNull: false },
				width: { type: DataTypes.INTEGER, allowNull: false },
				height: { type: DataTypes.INTEGER, allowNull: false },
				sourceFormat: { type: DataTypes.STRING(10), allowNull: false },
				createdAt: DataTypes.DATE
			},
			{ sequelize, tableName: 'photos', underscored: true, updatedAt: false }
		);
	}
}
