import { error } from '@sveltejs/kit';
import { Op } from 'sequelize';
import { median } from 'simple-statistics';
import type { z } from 'zod';
import { roleAllows } from '../../roles';
import type { shopSchema } from '../../schemas/shops';
import type { CurrentUser } from '../auth/current-user';
import { models, type Shop } from '../db/models';
import * as log from '../moderation/log';
import { deleteObjects } from '../storage';

export type ShopInput = z.output<typeof shopSchema>;

/** Displacement classes for the shop summary, by the representative setup's cc. */
export const CC_CLASSES = [
	{ label: 'up to 50 cc', max: 50 },
	{ label: '51–70 cc', max: 70 },
	{ label: '71–90 cc', max: 90 },
	{ label: 'over 90 cc', max: Infinity }
] as const;

export async function readShop(id: number): Promise<Shop | null> {
	return models().Shop.findByPk(id);
}

/** A shop page for readers: 404 when hidden by the desk, unless the reader is its owner or staff. */
export async function viewShop(id: number, me: CurrentUser | null) {
	const shop = await readShop(id);
	if (!shop) error(404, 'No such shop.');
	const acting = me ? await actsFor(me, shop) : false;
	const staff = me !== null && roleAllows(me.role, 'moderator');
	if (shop.moderation === 'hidden' && !acting && !staff) error(404, 'No such shop.');
	return { shop, acting, owner: me?.id === shop.ownerId };
}

/** Whether the account acts for the shop: its owner, or staff who accepted the invitation. */
export async function actsFor(me: CurrentUser, shop: Shop): Promise<boolean> {
	if (shop.ownerId === me.id) return true;
	return (await models().ShopStaff.count({ where: { shopId: shop.id, userId: me.id } })) > 0;
}

/** The shop an account acts for: its own shop page first, else the first it is staff of. */
export async function shopOf(me: CurrentUser): Promise<Shop | null> {
	const { Shop, ShopStaff } = models();
	const own = await Shop.findOne({ where: { ownerId: me.id } });
	if (own) return own;
	const staff = await ShopStaff.findOne({ where: { userId: me.id }, order: [['id', 'ASC']] });
	return staff ? Shop.findByPk(staff.shopId) : null;
}

/** The caller's shop for acting on it; 403 when they act for none. */
export async function requireShop(me: CurrentUser): Promise<Shop> {
	const shop = await shopOf(me);
	if (!shop) error(403, 'This needs a shop page: you do not act for a shop.');
	return shop;
}

/** The caller's own shop page, for what only its owner does (the page, staff, logo). */
export async function requireOwnShop(me: CurrentUser): Promise<Shop> {
	if (!roleAllows(me.role, 'shop')) error(403, 'This needs the shop role.');
	const shop = await models().Shop.findOne({ where: { ownerId: me.id } });
	if (!shop) error(404, 'Create your shop page first.');
	return shop;
}

/** Creates or updates the owner's shop page. */
export async function saveShop(me: CurrentUser, input: ShopInput): Promise<Shop> {
	if (!roleAllows(me.role, 'shop')) error(403, 'This needs the shop role.');
	const { Shop } = models();
	const existing = await Shop.findOne({ where: { ownerId: me.id } });
	if (existing) return existing.update(input);
	return Shop.create({ ownerId: me.id, ...input });
}

export async function listShops(opts: { verifiedOnly?: boolean } = {}) {
	const where = {
		moderation: 'visible' as const,
		...(opts.verifiedOnly ? { verifiedAt: { [Op.ne]: null } } : {})
	};
	return models().Shop.findAll({ where, order: [['name', 'ASC']] });
}

/** Shops that asked for nothing yet but wait for an admin's check: every unverified page. */
export async function awaitingVerification() {
	return models().Shop.findAll({
		where: { verifiedAt: null },
		order: [['createdAt', 'ASC']]
	});
}

/** Verification is an admin's stamp after checking the shop; giving and withdrawing are logged. */
export async function setVerified(
	me: CurrentUser,
	shopId: number,
	verified: boolean,
	reason: string,
	now: Date
) {
	if (!roleAllows(me.role, 'admin')) error(403, 'Only an admin verifies shops.');
	const shop = await readShop(shopId);
	if (!shop) error(404, 'No such shop.');
	await shop.update({ verifiedAt: verified ? now : null });
	await log.append({
		at: now,
		actorId: me.id,
		action: verified ? 'verify-shop' : 'unverify-shop',
		item: { type: 'shop', id: shop.id },
		subjectId: shop.ownerId,
		reason
	});
}

export type ShopSummary = {
	builds: number;
	speedByClass: { label: string; builds: number; medianKmh: number }[];
	costByCurrency: { currency: string; builds: number; medianMinor: number }[];
};

/** Figures over the shop's approved links to published, visible builds. */
export async function summarise(shopId: number): Promise<ShopSummary> {
	const { ShopLink, Build } = models();
	const ids = (
		await ShopLink.findAll({ where: { shopId, state: 'approved' }, attributes: ['buildId'] })
	).map((l) => l.buildId);
	const rows = ids.length
		? await Build.findAll({
				where: { id: [...new Set(ids)], publication: 'published', moderation: 'visible' },
				attributes: ['id', 'repCc', 'bestSpeedKmh', 'partsTotalMinor', 'currency']
			})
		: [];
	const speedByClass = CC_CLASSES.map((c, i) => {
		const min = i === 0 ? -Infinity : CC_CLASSES[i - 1].max;
		const speeds = rows
			.filter((b) => b.repCc !== null && b.repCc > min && b.repCc <= c.max)
			.map((b) => b.bestSpeedKmh)
			.filter((v): v is number => v !== null);
		return { label: c.label, builds: speeds.length, medianKmh: speeds.length ? median(speeds) : 0 };
	}).filter((c) => c.builds > 0);
	const currencies = [...new Set(rows.map((b) => b.currency))].sort();
	const costByCurrency = currencies
		.map((currency) => {
			const costs = rows
				.filter((b) => b.currency === currency && b.partsTotalMinor > 0)
				.map((b) => b.partsTotalMinor);
			return {
				currency,
				builds: costs.length,
				medianMinor: costs.length ? Math.round(median(costs)) : 0
			};
		})
		.filter((c) => c.builds > 0);
	return { builds: rows.length, speedByClass, costByCurrency };
}

/** Removes a shop page and its logo object (account deletion). */
export async function destroyShop(shop: Shop) {
	if (shop.logoKey) await deleteObjects([shop.logoKey]);
	await shop.destroy();
}
