import { Failure } from '../../failure';
import { models } from '../db/models';
import type { CurrentUser } from '../auth/current-user';
import * as log from '../review/log';
import { destroyBuild } from '../sheet/build-service';
import { refreshListing } from '../derived/recompute';
import { destroyShop } from '../shops/pages';
import { inTransaction } from '../db/transaction';

export type DeleteMode = 'delete-builds' | 'keep-anonymised';

/**
 * Deletes a member's account. Their builds go with it (photos' objects too), or the published
 * ones stay readable with no owner, as they chose. Comments stay as "a former member" so threads keep their sense;
 * a shop page goes with its logo. Foreign keys remove sign-in records, tokens, reports, staff
 * places and messages; the review desk's cases forget the author. The moderation log keeps its
 * lines, which then name "a removed account".
 */
export async function deleteAccount(me: CurrentUser, mode: DeleteMode, now: Date): Promise<void> {
	return inTransaction(async () => {
		const { Build, Shop, ReviewCase, User } = models();
		// Someone must be left to give roles and check shops.
		if (me.role === 'admin' && (await User.count({ where: { role: 'admin' } })) <= 1)
			throw new Failure(
				409,
				'You are the only admin. Make someone else an admin before you leave.'
			);
		const own = await Build.findAll({
			where: { ownerId: me.id },
			attributes: ['id', 'publication']
		});
		// Drafts go in both modes: with no owner, nobody could ever see or finish them.
		const kept = mode === 'keep-anonymised' ? own.filter((b) => b.publication === 'published') : [];
		for (const b of own) if (!kept.includes(b)) await destroyBuild(b.id);
		const shop = await Shop.findOne({ where: { ownerId: me.id } });
		if (shop) await destroyShop(shop);
		await ReviewCase.update({ authorId: null }, { where: { authorId: me.id } });
		await log.append({
			at: now,
			actorId: null,
			action: 'account-delete',
			subjectId: me.id,
			detail: { mode, builds: own.length }
		});
		await User.destroy({ where: { id: me.id } });
		// Kept builds now have no owner: their list rows are rewritten without the name.
		for (const b of kept) await refreshListing(b.id);
	});
}
