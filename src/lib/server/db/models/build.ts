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

export class Build extends Model<InferAttributes<Build>, InferCreationAttributes<Build>> {
	declare id: CreationOptional<number>;
	/** NULL once the owner deleted their account and chose to keep the build, anonymised. */
	declare ownerId: string | null;
	declare title: string;
	declare story: CreationOptional<string>;
	declare chassis: CreationOptional<string>;
	declare engineFamily: CreationOptional<string>;
	declare baseScooterId: CreationOptional<number | null>;
	declare engineCycle: CreationOptional<'two-stroke' | 'four-stroke'>;
	declare cooling: CreationOptional<'air' | 'liquid'>;
	declare cylinderOrientation: CreationOptional<'horizontal' | 'vertical'>;
	declare brakeFront: CreationOptional<string>;
	declare brakeRear: CreationOptional<string>;
	declare brakesUpgraded: CreationOptional<boolean>;
	declare currency: CreationOptional<string>;
	declare publication: CreationOptional<'draft' | 'published'>;
	declare publishedAt: CreationOptional<Date | null>;
	declare moderation: CreationOptional<'visible' | 'hidden'>;
	declare hiddenReason: CreationOptional<string | null>;
	declare commentsMailedAt: CreationOptional<Date | null>;
	declare version: CreationOptional<number>;
	declare bestSpeedKmh: CreationOptional<number | null>;
	declare stockSpeedKmh: CreationOptional<number | null>;
	declare partsTotalMinor: CreationOptional<number>;
	declare partsText: CreationOptional<string>;
	declare repPipe: CreationOptional<string>;
	declare repCc: CreationOptional<number | null>;
	declare repElevationM: CreationOptional<number | null>;
	declare setupCount: CreationOptional<number>;
	declare runCount: CreationOptional<number>;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;
	declare owner?: NonAttribute<User>;

	static setup(sequelize: Sequelize) {
		// A fresh object per attribute: Sequelize writes the column name into each definition.
		const str = () => ({ type: DataTypes.STRING, allowNull: false, defaultValue: '' });
		Build.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				ownerId: { type: DataTypes.UUID, allowNull: true },
				title: { type: DataTypes.STRING(120), allowNull: false },
				story: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
				chassis: str(),
				engineFamily: str(),
				baseScooterId: { type: DataTypes.INTEGER, allowNull: true },
				engineCycle: {
					type: DataTypes.ENUM('two-stroke', 'four-stroke'),
					allowNull: false,
					defaultValue: 'two-stroke'
				},
				cooling: { type: DataTypes.ENUM('air', 'liquid'), allowNull: false, defaultValue: 'air' },
				cylinderOrientation: {
					type: DataTypes.ENUM('horizontal', 'vertical'),
					allowNull: false,
					defaultValue: 'horizontal'
				},
				brakeFront: str(),
				brakeRear: str(),
				brakesUpgraded: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
				currency: { type: DataTypes.CHAR(3), allowNull: false, defaultValue: 'EUR' },
				publication: {
					type: DataTypes.ENUM('draft', 'published'),
					allowNull: false,
					defaultValue: 'draft'
				},
				publishedAt: DataTypes.DATE,
				moderation: {
					type: DataTypes.ENUM('visible', 'hidden'),
					allowNull: false,
					defaultValue: 'visible'
				},
				hiddenReason: DataTypes.STRING(500),
				commentsMailedAt: DataTypes.DATE,
				version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
				bestSpeedKmh: DataTypes.DOUBLE,
				stockSpeedKmh: DataTypes.DOUBLE,
				partsTotalMinor: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
				partsText: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
				repPipe: { type: DataTypes.STRING(20), allowNull: false, defaultValue: '' },
				repCc: DataTypes.DOUBLE,
				repElevationM: DataTypes.DOUBLE,
				setupCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
				runCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
				createdAt: DataTypes.DATE,
				updatedAt: DataTypes.DATE
			},
			{ sequelize, tableName: 'builds', underscored: true }
		);
	}
}
