import {
	DataTypes,
	Model,
	type CreationOptional,
	type InferAttributes,
	type InferCreationAttributes,
	type Sequelize
} from 'sequelize';
import {
	ITEM_TYPES,
	REPORT_REASONS,
	type ItemType,
	type ReportReason
} from '../../../review/kinds';

const itemType = { type: DataTypes.ENUM(...ITEM_TYPES), allowNull: false };
const status = {
	type: DataTypes.ENUM('open', 'closed'),
	allowNull: false,
	defaultValue: 'open'
};

export class Report extends Model<InferAttributes<Report>, InferCreationAttributes<Report>> {
	declare id: CreationOptional<number>;
	declare itemType: ItemType;
	declare itemId: number;
	declare reporterId: string;
	declare reason: ReportReason;
	declare note: string;
	declare status: CreationOptional<'open' | 'closed'>;
	declare createdAt: Date;
	declare closedAt: CreationOptional<Date | null>;

	static setup(sequelize: Sequelize) {
		Report.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				itemType,
				itemId: { type: DataTypes.INTEGER, allowNull: false },
				reporterId: { type: DataTypes.UUID, allowNull: false },
				reason: { type: DataTypes.ENUM(...REPORT_REASONS), allowNull: false },
				note: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: '' },
				status,
				createdAt: { type: DataTypes.DATE, allowNull: false },
				closedAt: DataTypes.DATE
			},
			{ sequelize, tableName: 'reports', underscored: true, timestamps: false }
		);
	}
}

/** An automatic flag: a tuning warning or a text rule matched. It raises, never hides. */
export class Flag extends Model<InferAttributes<Flag>, InferCreationAttributes<Flag>> {
	declare id: CreationOptional<number>;
	declare itemType: ItemType;
	declare itemId: number;
	declare code: string;
	declare detail: string;
	declare status: CreationOptional<'open' | 'closed'>;
	declare createdAt: Date;
	declare closedAt: CreationOptional<Date | null>;

	static setup(sequelize: Sequelize) {
		Flag.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				itemType,
				itemId: { type: DataTypes.INTEGER, allowNull: false },
				code: { type: DataTypes.STRING(60), allowNull: false },
				detail: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
				status,
				createdAt: { type: DataTypes.DATE, allowNull: false },
				closedAt: DataTypes.DATE
			},
			{ sequelize, tableName: 'flags', underscored: true, timestamps: false }
		);
	}
}

/** One item's standing with the review desk, across all its reports and flags. */
export class ReviewCase extends Model<
	InferAttributes<ReviewCase>,
	InferCreationAttributes<ReviewCase>
> {
	declare id: CreationOptional<number>;
	declare itemType: ItemType;
	declare itemId: number;
	declare authorId: string | null;
	declare onDesk: CreationOptional<boolean>;
	declare concern: CreationOptional<boolean>;
	declare caution: CreationOptional<boolean>;
	declare secondLook: CreationOptional<'none' | 'asked' | 'used'>;
	declare openedAt: Date;
	declare updatedAt: Date;

	static setup(sequelize: Sequelize) {
		ReviewCase.init(
			{
				id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
				itemType,
				itemId: { type: DataTypes.INTEGER, allowNull: false },
				authorId: DataTypes.UUID,
				onDesk: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
				concern: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
				caution: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
				secondLook: {
					type: DataTypes.ENUM('none', 'asked', 'used'),
					allowNull: false,
					defaultValue: 'none'
				},
				openedAt: { type: DataTypes.DATE, allowNull: false },
				updatedAt: { type: DataTypes.DATE, allowNull: false }
			},
			{ sequelize, tableName: 'review_cases', underscored: true, timestamps: false }
		);
	}
}

/** The append-only record of every desk decision; the app's database account cannot change it. */
export class LogEntry extends Model<InferAttributes<LogEntry>, InferCreationAttributes<LogEntry>> {
	declare id: CreationOptional<number>;
	declare at: Date;
	declare actorId: string | null;
	declare action: string;
	declare itemType: string | null;
	declare itemId: number | null;
	declare subjectId: string | null;
	declare reason: string;
	declare detail: Record<string, unknown> | null;

	static setup(sequelize: Sequelize) {
		LogEntry.init(
			{
				id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
				at: { type: DataTypes.DATE(3), allowNull: false },
				actorId: DataTypes.UUID,
				action: { type: DataTypes.STRING(40), allowNull: false },
				itemType: DataTypes.STRING(20),
				itemId: DataTypes.INTEGER,
				subjectId: DataTypes.UUID,
				reason: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: '' },
				detail: DataTypes.JSON
			},
			{ sequelize, tableName: 'moderation_log', underscored: true, timestamps: false }
		);
	}
}
