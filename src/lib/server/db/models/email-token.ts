import {
	DataTypes,
	Model,
	type CreationOptional,
	type InferAttributes,
	type InferCreationAttributes,
	type Sequelize
} from 'sequelize';

export type EmailTokenPurpose = 'verify' | 'reset';

/** Single-use links we mail ourselves (address verification, password reset). Only a hash is kept. */
export class EmailToken extends Model<
	InferAttributes<EmailToken>,
	InferCreationAttributes<EmailToken>
> {
	declare id: CreationOptional<number>;
	declare userId: string;
	declare purpose: EmailTokenPurpose;
	declare tokenHash: string;
	declare expiresAt: Date;
	declare usedAt: CreationOptional<Date | null>;
	declare createdAt: CreationOptional<Date>;

	static setup(sequelize: Sequelize) {
		EmailToken.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				userId: { type: DataTypes.UUID, allowNull: false },
				purpose: { type: DataTypes.ENUM('verify', 'reset'), allowNull: false },
				tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
				expiresAt: { type: DataTypes.DATE, allowNull: false },
				usedAt: DataTypes.DATE,
				createdAt: DataTypes.DATE
			},
			{ sequelize, tableName: 'email_tokens', underscored: true, updatedAt: false }
		);
	}
}
