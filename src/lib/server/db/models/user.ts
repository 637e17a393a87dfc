import {
	DataTypes,
	Model,
	type CreationOptional,
	type InferAttributes,
	type InferCreationAttributes,
	type Sequelize
} from 'sequelize';
import { ROLES, type Role } from '../../../roles';
import { THEMES, type Theme } from '../../../theme';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
	declare id: CreationOptional<string>;
	/** Display name; Auth.js calls it `name`. */
	declare name: string | null;
	declare email: string;
	declare emailVerified: Date | null;
	declare image: CreationOptional<string | null>;
	declare passwordHash: CreationOptional<string | null>;
	declare role: CreationOptional<Role>;
	declare suspendedAt: CreationOptional<Date | null>;
	declare suspendedReason: CreationOptional<string | null>;
	/** NULL with suspendedAt set: suspended until lifted. */
	declare suspendedUntil: CreationOptional<Date | null>;
	declare units: CreationOptional<'metric' | 'imperial'>;
	declare theme: CreationOptional<Theme>;
	declare mailComments: CreationOptional<boolean>;
	declare mailShop: CreationOptional<boolean>;
	/** Sessions issued under an older generation are refused (auth/sessions.ts). */
	declare sessionGeneration: CreationOptional<number>;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;

	static setup(sequelize: Sequelize) {
		User.init(
			{
				id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
				name: DataTypes.STRING(80),
				email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
				emailVerified: DataTypes.DATE,
				image: DataTypes.STRING(500),
				passwordHash: DataTypes.STRING(255),
				role: { type: DataTypes.ENUM(...ROLES), allowNull: false, defaultValue: 'member' },
				suspendedAt: DataTypes.DATE,
				suspendedReason: DataTypes.STRING(500),
				suspendedUntil: DataTypes.DATE,
				units: {
					type: DataTypes.ENUM('metric', 'imperial'),
					allowNull: false,
					defaultValue: 'metric'
				},
				theme: {
					type: DataTypes.ENUM(...THEMES),
					allowNull: false,
					defaultValue: 'device'
				},
				mailComments: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
				mailShop: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
				sessionGeneration: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
				createdAt: DataTypes.DATE,
				updatedAt: DataTypes.DATE
			},
			{ sequelize, tableName: 'users', underscored: true }
		);
	}
}
