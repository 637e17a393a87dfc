import { db } from '../connection';
// Account and Session associations are made by @auth/sequelize-adapter itself.
import { Account, Session, VerificationToken, setupAuthTables } from './auth-tables';
import { Build } from './build';
import { Comment } from './comment';
import { DeskNote } from './desk-note';
import { EmailToken } from './email-token';
import { Flag, LogEntry, Report, ReviewCase } from './moderation';
import { Part } from './part';
import { Photo } from './photo';
import { RidingConditions } from './riding-conditions';
import { Run } from './run';
import { BaseScooter, EngineFamily } from './scooter';
import { Setup } from './setup';
import { BuildTransfer, Shop, ShopLink, ShopMessage, ShopStaff } from './shop';
import { User } from './user';

export {
	Account,
	BaseScooter,
	EngineFamily,
	Build,
	BuildTransfer,
	Shop,
	ShopLink,
	ShopMessage,
	ShopStaff,
	Comment,
	Flag,
	LogEntry,
	Report,
	ReviewCase,
	DeskNote,
	EmailToken,
	Part,
	Photo,
	RidingConditions,
	Run,
	Session,
	Setup,
	User,
	VerificationToken
};

let ready = false;

/** Initialises every model and association once, on the shared connection. */
export function models() {
	if (!ready) {
		const sequelize = db();
		User.setup(sequelize);
		setupAuthTables(sequelize);
		EmailToken.setup(sequelize);
		DeskNote.setup(sequelize);
		Build.setup(sequelize);
		Setup.setup(sequelize);
		Run.setup(sequelize);
		Part.setup(sequelize);
		Photo.setup(sequelize);
		Comment.setup(sequelize);
		Report.setup(sequelize);
		Flag.setup(sequelize);
		ReviewCase.setup(sequelize);
		LogEntry.setup(sequelize);
		Shop.setup(sequelize);
		ShopStaff.setup(sequelize);
		ShopLink.setup(sequelize);
		BuildTransfer.setup(sequelize);
		ShopMessage.setup(sequelize);
		RidingConditions.setup(sequelize);
		EngineFamily.setup(sequelize);
		BaseScooter.setup(sequelize);
		BaseScooter.belongsTo(EngineFamily, { foreignKey: 'engineFamilyId', as: 'family' });
		ShopLink.belongsTo(Shop, { foreignKey: 'shopId', as: 'shop' });
		ShopMessage.belongsTo(User, { foreignKey: 'senderId', as: 'sender' });
		Comment.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
		Build.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' });
		Build.hasMany(Setup, { foreignKey: 'buildId', as: 'setups' });
		Setup.hasMany(Run, { foreignKey: 'setupId', as: 'runs' });
		Build.hasMany(Part, { foreignKey: 'buildId', as: 'parts' });
		EmailToken.belongsTo(User, { foreignKey: 'userId', onDelete: 'CASCADE' });
		DeskNote.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
		ready = true;
	}
	return {
		User,
		Account,
		Session,
		VerificationToken,
		EmailToken,
		DeskNote,
		Build,
		Setup,
		Run,
		Part,
		Photo,
		Comment,
		Report,
		Flag,
		ReviewCase,
		LogEntry,
		Shop,
		ShopStaff,
		ShopLink,
		BuildTransfer,
		ShopMessage,
		EngineFamily,
		BaseScooter,
		RidingConditions
	};
}
