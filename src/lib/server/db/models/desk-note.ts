import {
	DataTypes,
	Model,
	type CreationOptional,
	type InferAttributes,
	type InferCreationAttributes,
	type NonAttribute,
	type Sequelize
} from 'sequelize';
import type { User } from './user';

/** A note moderators leave each other on the review desk. */
export class DeskNote extends Model<InferAttributes<DeskNote>, InferCreationAttributes<DeskNote>> {
	declare id: CreationOptional<number>;
	declare authorId: string;
	declare body: string;
	declare createdAt: CreationOptional<Date>;
	declare author?: NonAttribute<User>;

	static setup(sequelize: Sequelize) {
		DeskNote.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				authorId: { type: DataTypes.UUID, allowNull: false },
				body: { type: DataTypes.STRING(1000), allowNull: false },
				createdAt: DataTypes.DATE
			},
			{ sequelize, tableName: 'desk_notes', underscored: true, updatedAt: false }
		);
	}
}
