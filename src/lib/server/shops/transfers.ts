import { Failure } from '../../failure';
import type { CurrentUser } from '../auth/current-user';
import { inTransaction } from '../db/transaction';
import { models, type BuildTransfer, type Shop } from '../db/models';
import * as builds from '../sheet/builds';
import { normaliseEmail } from '../auth/users';
import { send } from '../mail/send';
import * as log from '../review/log';
import { refreshListing } from '../derived/recompute';
import { transferOffer } from './letters';
import { checkToken, makeToken, type TokenProblem } from './tokens';

export type HandoverView = {
	id: number;
	buildId: number;
	buildTitle: string;
	shopName: string;
	toEmail: string;
	state: 'pending' | 'accepted' | 'cancelled';
};

/** Offers as lists show them: one query for the offers, one for their builds and shops each. */
async function views(rows: BuildTransfer[]): Promise<HandoverView[]> {
	if (!rows.length) return [];
	const { Build, Shop } = models();
	const [bs, ss] = await Promise.all([
		Build.findAll({ where: { id: rows.map((t) => t.buildId) }, attributes: ['id', 'title'] }),
		Shop.findAll({ where: { id: rows.map((t) => t.shopId) }, attributes: ['id', 'name'] })
	]);
	return rows.flatMap((t) => {
		const b = bs.find((x) => x.id === t.buildId);
		const s = ss.find((x) => x.id === t.shopId);
		return b && s
			? [
					{
						id: t.id,
						buildId: b.id,
						buildTitle: b.title,
						shopName: s.name,
						toEmail: t.toEmail,
						state: t.state
					}
				]
			: [];
	});
}

async function view(id: number): Promise<HandoverView | null> {
	const t = await models().BuildTransfer.findByPk(id);
	return t ? ((await views([t]))[0] ?? null) : null;
}

/** Whose sheets a shop may hand over: its owner's and those of staff who joined. */
async function handsOver(shop: Shop, ownerId: string | null): Promise<boolean> {
	if (!ownerId) return false;
	if (ownerId === shop.ownerId) return true;
	const staff = await models().ShopStaff.count({ where: { shopId: shop.id, userId: ownerId } });
	return staff > 0;
}

/**
 * A shop offers one of its own build sheets (its owner's, or the offering staff member's) to a
 * customer's address. One offer at a time per
 * build; the build stays the shop's until the customer accepts.
 */
export async function offerHandover(
	me: CurrentUser,
	shop: Shop,
	input: { buildId: number; email: string },
	now: Date
) {
	return inTransaction(async () => {
		const { BuildTransfer } = models();
		const b = await builds.read(input.buildId);
		const ours = b && (b.ownerId === shop.ownerId || b.ownerId === me.id);
		if (!b || !ours || !(await handsOver(shop, b.ownerId)))
			throw new Failure(404, 'No such build sheet of your shop.');
		const email = normaliseEmail(input.email);
		const pending = await BuildTransfer.findOne({ where: { buildId: b.id, state: 'pending' } });
		if (pending)
			throw new Failure(
				409,
				`That sheet is already offered to ${pending.toEmail}. Withdraw that first.`
			);
		const t = await BuildTransfer.create({
			buildId: b.id,
			shopId: shop.id,
			toEmail: email,
			state: 'pending'
		});
		await log.append({
			at: now,
			actorId: me.id,
			action: 'handover-offer',
			item: { type: 'build', id: b.id },
			subjectId: shop.ownerId,
			detail: { shopId: shop.id, transferId: t.id, to: email }
		});
		await send(
			transferOffer({
				to: email,
				shopName: shop.name,
				buildTitle: b.title,
				token: makeToken('build-transfer', { t: t.id }, now)
			})
		);
		return t;
	});
}

export async function withdrawHandover(me: CurrentUser, shop: Shop, transferId: number, now: Date) {
	return inTransaction(async () => {
		const { BuildTransfer } = models();
		const [n] = await BuildTransfer.update(
			{ state: 'cancelled', decidedAt: now },
			{ where: { id: transferId, shopId: shop.id, state: 'pending' } }
		);
		if (n !== 1) throw new Failure(409, 'That offer is not open any more.');
		const t = (await BuildTransfer.findByPk(transferId))!;
		await log.append({
			at: now,
			actorId: me.id,
			action: 'handover-withdraw',
			item: { type: 'build', id: t.buildId },
			subjectId: shop.ownerId,
			detail: { shopId: shop.id, transferId }
		});
	});
}

export async function handoversOfShop(shopId: number) {
	const rows = await models().BuildTransfer.findAll({
		where: { shopId },
		order: [['id', 'DESC']],
		limit: 100
	});
	return views(rows);
}

/** Offers waiting for this account (by its address), for the bench. */
export async function handoversFor(me: CurrentUser) {
	const rows = await models().BuildTransfer.findAll({
		where: { toEmail: normaliseEmail(me.email), state: 'pending' },
		order: [['id', 'ASC']]
	});
	return views(rows);
}

export type HandoverCheck =
	| { ok: true; handover: HandoverView }
	| { ok: false; problem: TokenProblem; handover?: HandoverView };

/** What a mailed handover link is about; nothing changes by looking. */
export async function inspectHandover(token: string, now: Date): Promise<HandoverCheck> {
	const c = checkToken<{ t: number }>('build-transfer', token, now);
	if (!c.ok) return c;
	const h = await view(c.payload.t);
	if (!h || h.state !== 'pending') return { ok: false, problem: 'used', handover: h ?? undefined };
	return { ok: true, handover: h };
}

/**
 * The customer takes the sheet: it becomes theirs, and the shop is named on it as its builder.
 * Only the account with the offered address can accept, by mail link or from the bench.
 */
export async function acceptHandover(
	me: CurrentUser,
	by: { token: string } | { transferId: number },
	now: Date
): Promise<HandoverCheck> {
	return inTransaction(async () => {
		const { BuildTransfer, ShopLink, Shop } = models();
		let id: number;
		if ('token' in by) {
			const c = checkToken<{ t: number }>('build-transfer', by.token, now);
			if (!c.ok) return c;
			id = c.payload.t;
		} else id = by.transferId;
		const t = await BuildTransfer.findByPk(id);
		if (!t) return { ok: false, problem: 'used' };
		if (t.toEmail !== normaliseEmail(me.email))
			throw new Failure(
				403,
				`This sheet was offered to ${t.toEmail}; sign in with that address to accept it.`
			);
		const shop = await Shop.findByPk(t.shopId);
		const from = await models().Build.findByPk(t.buildId, { attributes: ['ownerId'] });
		if (!shop || !from || !(await handsOver(shop, from.ownerId)))
			return { ok: false, problem: 'used' };
		const moved = await inTransaction(async (transaction) => {
			const [n] = await BuildTransfer.update(
				{ state: 'accepted', decidedAt: now },
				{ where: { id: t.id, state: 'pending' }, transaction }
			);
			if (n !== 1) return false;
			await models().Build.update(
				{ ownerId: me.id },
				{ where: { id: t.buildId, ownerId: from.ownerId! }, transaction }
			);
			{
				const named = await ShopLink.count({
					where: { buildId: t.buildId, shopId: shop.id, state: 'approved' },
					transaction
				});
				if (!named)
					await ShopLink.create(
						{
							buildId: t.buildId,
							shopId: shop.id,
							kind: 'built',
							state: 'approved',
							requestedBy: shop.ownerId,
							decidedAt: now
						},
						{ transaction }
					);
			}
			return true;
		});
		const h = (await view(t.id))!;
		if (!moved) return { ok: false, problem: 'used', handover: h };
		await log.append({
			at: now,
			actorId: me.id,
			action: 'handover-accept',
			item: { type: 'build', id: t.buildId },
			subjectId: me.id,
			detail: { shopId: t.shopId, transferId: t.id, via: 'token' in by ? 'mail' : 'app' }
		});
		await refreshListing(t.buildId);
		return { ok: true, handover: h };
	});
}
