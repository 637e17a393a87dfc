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

const stamps = { createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE };
const options = (sequelize: Sequelize, tableName: string) => ({
	sequelize,
	tableName,
	underscored: true
});

/** A shop page, owned by one account with the shop role. */
export class Shop extends Model<InferAttributes<Shop>, InferCreationAttributes<Shop>> {
	declare id: CreationOptional<number>;
	declare ownerId: string;
	declare name: string;
	declare region: CreationOptional<string>;
	declare services: string;
	declare openingNote: CreationOptional<string>;
	declare logoKey: CreationOptional<string | null>;
	declare verifiedAt: CreationOptional<Date | null>;
	declare moderation: CreationOptional<'visible' | 'hidden'>;
	declare hiddenReason: CreationOptional<string | null>;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;

	static setup(sequelize: Sequelize) {
		Shop.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				ownerId: { type: DataTypes.UUID, allowNull: false },
				name: { type: DataTypes.STRING(120), allowNull: false },
				region: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
				services: { type: DataTypes.TEXT, allowNull: false },
				openingNote: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
				logoKey: DataTypes.STRING(300),
				verifiedAt: DataTypes.DATE,
				moderation: {
					type: DataTypes.ENUM('visible', 'hidden'),
					allowNull: false,
					defaultValue: 'visible'
				},
				hiddenReason: DataTypes.STRING(500),
				...stamps
			},
			options(sequelize, 'shops')
		);
	}
}

/** Someone the owner invited by address to act for the shop; user set once they accept. */
export class ShopStaff extends Model<
	InferAttributes<ShopStaff>,
	InferCreationAttributes<ShopStaff>
> {
	declare id: CreationOptional<number>;
	declare shopId: number;
	declare email: string;
	declare userId: CreationOptional<string | null>;
	declare acceptedAt: CreationOptional<Date | null>;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;

	static setup(sequelize: Sequelize) {
		ShopStaff.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				shopId: { type: DataTypes.INTEGER, allowNull: false },
				email: { type: DataTypes.STRING(254), allowNull: false },
				userId: DataTypes.UUID,
				acceptedAt: DataTypes.DATE,
				...stamps
			},
			options(sequelize, 'shop_staff')
		);
	}
}

export type LinkKind = 'built' | 'tuned';
export type LinkState = 'requested' | 'approved' | 'declined' | 'unlinked';

/** A shop's claim to have built or tuned a build; it shows only once the build's owner approves. */
export class ShopLink extends Model<InferAttributes<ShopLink>, InferCreationAttributes<ShopLink>> {
	declare id: CreationOptional<number>;
	declare buildId: number;
	declare shopId: number;
	declare kind: LinkKind;
	declare state: LinkState;
	declare note: CreationOptional<string>;
	declare requestedBy: string | null;
	declare decidedAt: CreationOptional<Date | null>;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;
	declare shop?: NonAttribute<Shop>;

	static setup(sequelize: Sequelize) {
		ShopLink.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				buildId: { type: DataTypes.INTEGER, allowNull: false },
				shopId: { type: DataTypes.INTEGER, allowNull: false },
				kind: { type: DataTypes.ENUM('built', 'tuned'), allowNull: false },
				state: {
					type: DataTypes.ENUM('requested', 'approved', 'declined', 'unlinked'),
					allowNull: false
				},
				note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
				requestedBy: DataTypes.UUID,
				decidedAt: DataTypes.DATE,
				...stamps
			},
			options(sequelize, 'shop_links')
		);
	}
}

/** A shop's draft on its way to a customer's account; the build stays the shop's until accepted. */
export class BuildTransfer extends Model<
	InferAttributes<BuildTransfer>,
	InferCreationAttributes<BuildTransfer>
> {
	declare id: CreationOptional<number>;
	declare buildId: number;
	declare shopId: number;
	declare toEmail: string;
	declare state: 'pending' | 'accepted' | 'cancelled';
	declare decidedAt: CreationOptional<Date | null>;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;

	static setup(sequelize: Sequelize) {
		BuildTransfer.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				buildId: { type: DataTypes.INTEGER, allowNull: false },
				shopId: { type: DataTypes.INTEGER, allowNull: false },
				toEmail: { type: DataTypes.STRING(254), allowNull: false },
				state: {
					type: DataTypes.ENUM('pending', 'accepted', 'cancelled'),
					allowNull: false
				},
				decidedAt: DataTypes.DATE,
				...stamps
			},
			options(sequelize, 'build_transfers')
		);
	}
}

/** A member's message to a shop; the sender's address is shown to the shop only after it replies. */
export class ShopMessage extends Model<
	InferAttributes<ShopMessage>,
	InferCreationAttributes<ShopMessage>
> {
	declare id: CreationOptional<number>;
	declare shopId: number;
	declare senderId: string;
	declare body: string;
	declare reply: CreationOptional<string | null>;
	declare repliedAt: CreationOptional<Date | null>;
	declare repliedBy: CreationOptional<string | null>;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;
	declare sender?: NonAttribute<User>;

	static setup(sequelize: Sequelize) {
		ShopMessage.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				shopId: { type: DataTypes.INTEGER, allowNull: false },
				senderId: { type: DataTypes.UUID, allowNull: false },
				body: { type: DataTypes.TEXT, allowNull: false },
				reply: DataTypes.TEXT,
				repliedAt: DataTypes.DATE,
				repliedBy: DataTypes.UUID,
				...stamps
			},
			options(sequelize, 'shop_messages')
		);
	}
}
