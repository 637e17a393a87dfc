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

/** A member's comment on a published build, optionally about one of its setups; one level of replies. */
export class Comment extends Model<InferAttributes<Comment>, InferCreationAttributes<Comment>> {
	declare id: CreationOptional<number>;
	declare buildId: number;
	declare setupId: number | null;
	declare parentId: number | null;
	declare authorId: string | null;
	declare body: string;
	declare moderation: CreationOptional<'visible' | 'hidden'>;
	declare hiddenReason: CreationOptional<string | null>;
	declare deletedAt: CreationOptional<Date | null>;
	declare editedAt: CreationOptional<Date | null>;
	declare notifiedAt: CreationOptional<Date | null>;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;
	declare author?: NonAttribute<User | null>;

	static setup(sequelize: Sequelize) {
		Comment.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				buildId: { type: DataTypes.INTEGER, allowNull: false },
				setupId: DataTypes.INTEGER,
				parentId: DataTypes.INTEGER,
				authorId: DataTypes.UUID,
				body: { type: DataTypes.TEXT, allowNull: false },
				moderation: {
					type: DataTypes.ENUM('visible', 'hidden'),
					allowNull: false,
					defaultValue: 'visible'
				},
				hiddenReason: DataTypes.STRING(500),
				deletedAt: DataTypes.DATE,
				editedAt: DataTypes.DATE,
				notifiedAt: DataTypes.DATE,
				createdAt: DataTypes.DATE,
				updatedAt: DataTypes.DATE
			},
			// Timestamps are set by the caller's clock, so digests can be tested with a fake one.
			{ sequelize, tableName: 'comments', underscored: true, timestamps: false }
		);
	}
}
