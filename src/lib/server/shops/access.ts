import { error, type RequestEvent } from '@sveltejs/kit';
import { roleAllows } from '../../roles';
import type { CurrentUser } from '../auth/current-user';
import { models, type Shop } from '../db/models';
import { requireUser } from '../guard';
import { actsFor, readShop, shopOf } from './pages';

// Who may see a shop page and who may act for a shop: the shops' counterpart of the guard,
// answering for pages with SvelteKit's error() as the guard does.

/** A shop page for readers: 404 when hidden by the desk, unless the reader is its owner or staff. */
export async function viewShop(id: number, me: CurrentUser | null) {
	const shop = await readShop(id);
	if (!shop) error(404, 'No such shop.');
	const acting = me ? await actsFor(me, shop) : false;
	const staff = me !== null && roleAllows(me.role, 'moderator');
	if (shop.moderation === 'hidden' && !acting && !staff) error(404, 'No such shop.');
	return { shop, acting, owner: me?.id === shop.ownerId };
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

/** Who may open the shop desk: shop accounts (to create their page) and accepted staff. */
export async function shopDesk(event: RequestEvent) {
	const me = requireUser(event);
	const shop = await shopOf(me);
	if (!shop && !roleAllows(me.role, 'shop'))
		error(403, 'The shop desk is for shop accounts and their staff.');
	return { me, shop };
}

/** The signed-in member and the shop they act for (owner or staff); 403 when none. */
export async function actingFor(event: RequestEvent): Promise<{ me: CurrentUser; shop: Shop }> {
	const me = requireUser(event);
	return { me, shop: await requireShop(me) };
}
