import { Failure } from '../../failure';
import type { CurrentUser } from '../auth/current-user';
import { models, type Shop } from '../db/models';
import { normaliseEmail } from '../auth/users';
import { send } from '../mail/send';
import * as log from '../review/log';
import { staffInvite } from './letters';
import { checkToken, makeToken, type TokenProblem } from './tokens';
import { inTransaction } from '../db/transaction';

export async function staffOf(shopId: number) {
	const { ShopStaff } = models();
	const rows = await ShopStaff.findAll({ where: { shopId }, order: [['id', 'ASC']] });
	return rows.map((s) => ({ id: s.id, email: s.email, joined: s.acceptedAt !== null }));
}

/** The owner invites an address; the invitation mail carries a signed, one-day link. */
export async function inviteStaff(me: CurrentUser, shop: Shop, email: string, now: Date) {
	return inTransaction(async () => {
		const { ShopStaff } = models();
		const address = normaliseEmail(email);
		if (address === normaliseEmail(me.email)) throw new Failure(400, 'You are the owner already.');
		const [row] = await ShopStaff.findOrCreate({
			where: { shopId: shop.id, email: address },
			defaults: { shopId: shop.id, email: address }
		});
		if (row.acceptedAt) throw new Failure(409, 'That address is already on your staff.');
		await send(
			staffInvite({
				to: address,
				shopName: shop.name,
				token: makeToken('shop-staff', { s: row.id, e: address }, now)
			})
		);
		await log.append({
			at: now,
			actorId: me.id,
			action: 'staff-invite',
			item: { type: 'shop', id: shop.id },
			subjectId: me.id,
			detail: { to: address }
		});
	});
}

export async function removeStaff(me: CurrentUser, shop: Shop, staffId: number, now: Date) {
	return inTransaction(async () => {
		const n = await models().ShopStaff.destroy({ where: { id: staffId, shopId: shop.id } });
		if (n !== 1) throw new Failure(404, 'No such person on your staff.');
		await log.append({
			at: now,
			actorId: me.id,
			action: 'staff-remove',
			item: { type: 'shop', id: shop.id },
			subjectId: me.id,
			detail: { staffId }
		});
	});
}

export type JoinResult = { ok: true; shopName: string } | { ok: false; problem: TokenProblem };

/** The invited account joins, if it is signed in with the invited address. */
export async function joinStaff(me: CurrentUser, token: string, now: Date): Promise<JoinResult> {
	return inTransaction(async () => {
		const c = checkToken<{ s: number; e: string }>('shop-staff', token, now);
		if (!c.ok) return c;
		const { ShopStaff, Shop } = models();
		const row = await ShopStaff.findByPk(c.payload.s);
		if (!row || row.email !== c.payload.e) return { ok: false, problem: 'used' };
		if (row.email !== normaliseEmail(me.email))
			throw new Failure(403, `This invitation is for ${row.email}; sign in with that address.`);
		const [n] = await ShopStaff.update(
			{ userId: me.id, acceptedAt: now },
			{ where: { id: row.id, acceptedAt: null } }
		);
		if (n !== 1) return { ok: false, problem: 'used' };
		const shop = await Shop.findByPk(row.shopId);
		return { ok: true, shopName: shop?.name ?? 'the shop' };
	});
}
