import { Failure } from '../../failure';
import type { z } from 'zod';
import { roleAllows } from '../../roles';
import type { shopSchema } from '../../schemas/shops';
import type { CurrentUser } from '../auth/current-user';
import type { LinkedBuild } from '../../shops/summary';
import { models, type Shop } from '../db/models';
import * as log from '../review/log';
import { deleteAfterCommit } from '../storage/objects';
import { inTransaction } from '../db/transaction';
import { parseJson, scalar } from '../db/nested';

export type ShopInput = z.output<typeof shopSchema>;

export async function readShop(id: number): Promise<Shop | null> {
	return models().Shop.findByPk(id);
}

/** Whether the account acts for the shop: its owner, or staff who accepted the invitation. */
export async function actsFor(me: CurrentUser, shop: Shop): Promise<boolean> {
	if (shop.ownerId === me.id) return true;
	return (await models().ShopStaff.count({ where: { shopId: shop.id, userId: me.id } })) > 0;
}

/** The account's own shop page, if it has one. */
export async function ownShop(userId: string): Promise<Shop | null> {
	return models().Shop.findOne({ where: { ownerId: userId } });
}

/** Whether an account sees the shop desk: shop accounts always, others once on a shop's staff. */
export async function seesShopDesk(me: CurrentUser): Promise<boolean> {
	return (
		roleAllows(me.role, 'shop') ||
		(await models().ShopStaff.count({ where: { userId: me.id } })) > 0
	);
}

/**
 * The shop an account acts for (its own shop page first, else the first it is staff of), as
 * `{ id, name }` in one column of a page's SELECT (db/nested.ts; replacement `me`).
 */
export const actingShopColumn = () =>
	scalar(
		`(SELECT JSON_ARRAY(t.id, t.name) FROM (
			SELECT id, name, 0 AS o, 0 AS k FROM shops WHERE owner_id = :me
			UNION ALL
			SELECT sh.id, sh.name, 1, st.id FROM shop_staff st JOIN shops sh ON sh.id = st.shop_id
			WHERE st.user_id = :me
		) t ORDER BY t.o, t.k LIMIT 1)`,
		(v) => {
			const found = parseJson(v) as [number, string] | null;
			return found ? { id: found[0], name: found[1] } : null;
		}
	);

/** The shop an account acts for: its own shop page first, else the first it is staff of. */
export async function shopOf(me: CurrentUser): Promise<Shop | null> {
	const { Shop, ShopStaff } = models();
	const own = await Shop.findOne({ where: { ownerId: me.id } });
	if (own) return own;
	const staff = await ShopStaff.findOne({ where: { userId: me.id }, order: [['id', 'ASC']] });
	return staff ? Shop.findByPk(staff.shopId) : null;
}

/** Creates or updates the owner's shop page. */
export async function saveShop(me: CurrentUser, input: ShopInput): Promise<Shop> {
	return inTransaction(async () => {
		if (!roleAllows(me.role, 'shop')) throw new Failure(403, 'This needs the shop role.');
		const { Shop } = models();
		const existing = await Shop.findOne({ where: { ownerId: me.id } });
		if (existing) return existing.update(input);
		return Shop.create({ ownerId: me.id, ...input });
	});
}

/** Shop pages readers may see, by name. */
export async function listShops() {
	return models().Shop.findAll({ where: { moderation: 'visible' }, order: [['name', 'ASC']] });
}

/** The admin's table of shops: those waiting for a check (oldest first) or all, with counts. */
export async function shopsForCheck(opts: { show: 'waiting' | 'all'; sort: 'oldest' | 'name' }) {
	const { Shop, User, ShopLink } = models();
	const rows = await Shop.findAll({
		where: opts.show === 'waiting' ? { verifiedAt: null } : {},
		order: opts.sort === 'name' ? [['name', 'ASC']] : [['createdAt', 'ASC']],
		limit: 200
	});
	const owners = rows.length
		? await User.findAll({ where: { id: rows.map((r) => r.ownerId) }, attributes: ['id', 'email'] })
		: [];
	const links = await Promise.all(
		rows.map((r) => ShopLink.count({ where: { shopId: r.id, state: 'approved' } }))
	);
	return rows.map((s, i) => ({
		id: s.id,
		name: s.name,
		region: s.region,
		owner: owners.find((o) => o.id === s.ownerId)?.email ?? '—',
		created: s.createdAt.toISOString(),
		verified: s.verifiedAt?.toISOString() ?? null,
		links: links[i]
	}));
}

/** Verification is an admin's stamp after checking the shop; giving and withdrawing are logged. */
export async function setVerified(
	me: CurrentUser,
	shopId: number,
	verified: boolean,
	reason: string,
	now: Date
) {
	return inTransaction(async () => {
		if (!roleAllows(me.role, 'admin')) throw new Failure(403, 'Only an admin verifies shops.');
		const shop = await readShop(shopId);
		if (!shop) throw new Failure(404, 'No such shop.');
		await shop.update({ verifiedAt: verified ? now : null });
		await log.append({
			at: now,
			actorId: me.id,
			action: verified ? 'verify-shop' : 'unverify-shop',
			item: { type: 'shop', id: shop.id },
			subjectId: shop.ownerId,
			reason
		});
	});
}

/** A shop page as plain data for its own page and the shop desk. */
export function shopView(shop: Shop) {
	return {
		id: shop.id,
		name: shop.name,
		region: shop.region,
		services: shop.services,
		openingNote: shop.openingNote,
		logo: shop.logoKey !== null,
		verified: shop.verifiedAt !== null,
		hidden: shop.moderation === 'hidden',
		hiddenReason: shop.hiddenReason
	};
}

/** The published, visible builds a shop is named on with their owners' agreement, newest first. */
export async function linkedBuilds(shopId: number): Promise<LinkedBuild[]> {
	const { ShopLink, Build } = models();
	const links = await ShopLink.findAll({
		where: { shopId, state: 'approved' },
		order: [['decidedAt', 'DESC']]
	});
	const rows = links.length
		? await Build.findAll({
				where: {
					id: links.map((l) => l.buildId),
					publication: 'published',
					moderation: 'visible'
				},
				attributes: ['id', 'title', 'repCc', 'bestSpeedKmh', 'partsTotalMinor', 'currency']
			})
		: [];
	const byId = new Map(rows.map((b) => [b.id, b]));
	return links.flatMap((l) => {
		const b = byId.get(l.buildId);
		return b
			? [
					{
						id: b.id,
						title: b.title,
						kind: l.kind,
						cc: b.repCc,
						bestKmh: b.bestSpeedKmh,
						partsMinor: b.partsTotalMinor,
						currency: b.currency
					}
				]
			: [];
	});
}

/** Removes a shop page and its logo object (account deletion). */
export async function destroyShop(shop: Shop) {
	await inTransaction(async () => {
		await shop.destroy();
		if (shop.logoKey) await deleteAfterCommit([shop.logoKey]);
	});
}
