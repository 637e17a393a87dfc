import { db } from '../connection';
// Account and Session associations are made by @auth/sequelize-adapter itself.
import { Account, Session, VerificationToken, setupAuthTables } from './auth-tables';
import { DeskNote } from './desk-note';
import { EmailToken } from './email-token';
import { User } from './user';

export { Account, DeskNote, EmailToken, Session, User, VerificationToken };

let ready = false;

/** Initialises every model and association once, on the shared connection. */
export function models() {
	if (!ready) {
		const sequelize = db();
		User.setup(sequelize);
		setupAuthTables(sequelize);
		EmailToken.setup(sequelize);
		DeskNote.setup(sequelize);
		EmailToken.belongsTo(User, { foreignKey: 'userId', onDelete: 'CASCADE' });
		DeskNote.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
		ready = true;
	}
	return { User, Account, Session, VerificationToken, EmailToken, DeskNote };
}
