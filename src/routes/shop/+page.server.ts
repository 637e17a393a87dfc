import { Failure } from '$lib/failure';
import { error, fail, redirect } from '@sveltejs/kit';
import { roleAllows } from '$lib/roles';
import {
	linkRequestSchema,
	replySchema,
	shopSchema,
	staffInviteSchema,
	staffRemoveSchema,
	transferRefSchema,
	transferSchema
} from '$lib/schemas/shops';
import { clock } from '$lib/clock';
import * as builds from '$lib/server/sheet/builds';
import { requireUser } from '$lib/server/guard';
import { parseForm } from '$lib/server/web/plain-form';
import { linksOfShop, requestLink } from '$lib/server/shops/links';
import { removeLogo, setLogo } from '$lib/server/shops/logo';
import { messagesOf, replyToMessage } from '$lib/server/shops/messages';
import { actingFor, requireOwnShop, shopDesk } from '$lib/server/shops/access';
import { saveShop, shopView } from '$lib/server/shops/pages';
import { inviteStaff, removeStaff, staffOf } from '$lib/server/shops/staff';
import { handoversOfShop, offerHandover, withdrawHandover } from '$lib/server/shops/transfers';
import { forPages } from '$lib/server/web/page-failure';
import type { Actions, PageServerLoad } from './$types';

const done = (anchor: string) => redirect(303, `/shop#${anchor}`);

/** A refusal from the shop rules (409 already asked, 404 no such build) shown beside the form. */
async function kept<T>(slot: string, values: Record<string, string>, step: () => Promise<T>) {
	try {
		await step();
		return null;
	} catch (e) {
		if (e instanceof Failure && e.status < 500)
			return fail(e.status, { [slot]: { values, message: e.message } });
		throw e;
	}
}

export const load: PageServerLoad = async (event) => {
	const { me, shop } = await shopDesk(event);
	if (!shop) return { shop: null, owner: true };
	const [staff, links, handovers, messages, own] = await Promise.all([
		staffOf(shop.id),
		linksOfShop(shop.id),
		handoversOfShop(shop.id),
		messagesOf(shop.id),
		builds.listBench(shop.ownerId)
	]);
	// Staff hand over sheets they filled in themselves, as well as the owner's.
	const staffOwn = shop.ownerId === me.id ? [] : await builds.listBench(me.id);
	return {
		shop: shopView(shop),
		owner: shop.ownerId === me.id,
		staff,
		links,
		handovers,
		messages,
		shopBuilds: [...own, ...staffOwn].map((b) => ({
			id: b.id,
			title: b.title,
			publication: b.publication
		}))
	};
};

export const actions: Actions = forPages({
	save: async (event) => {
		const me = requireUser(event);
		if (!roleAllows(me.role, 'shop')) error(403, 'This needs the shop role.');
		const form = await parseForm(event.request, shopSchema);
		if (!form.ok) return fail(400, { page: { values: form.values, message: form.message } });
		await saveShop(me, form.data);
		// The page says it was saved: a redirect alone looks the same as nothing happening.
		redirect(303, '/shop?saved=page#page');
	},
	logo: async (event) => {
		const me = requireUser(event);
		const shop = await requireOwnShop(me);
		const file = (await event.request.formData()).get('logo');
		if (!(file instanceof File) || file.size === 0)
			return fail(400, { logo: { message: 'Choose an image file first.' } });
		try {
			await setLogo(shop, new Uint8Array(await file.arrayBuffer()));
		} catch (e) {
			if (e instanceof Failure) return fail(e.status, { logo: { message: e.message } });
			throw e;
		}
		done('page');
	},
	removeLogo: async (event) => {
		const me = requireUser(event);
		await removeLogo(await requireOwnShop(me));
		done('page');
	},
	invite: async (event) => {
		const me = requireUser(event);
		const shop = await requireOwnShop(me);
		const form = await parseForm(event.request, staffInviteSchema);
		if (!form.ok) return fail(400, { staff: { values: form.values, message: form.message } });
		const refused = await kept('staff', form.values, () =>
			inviteStaff(me, shop, form.data.email, clock())
		);
		if (refused) return refused;
		return { staff: { values: {}, message: `Invitation mailed to ${form.data.email}.` } };
	},
	removeStaff: async (event) => {
		const me = requireUser(event);
		const shop = await requireOwnShop(me);
		const form = await parseForm(event.request, staffRemoveSchema);
		if (!form.ok) return fail(400, { staff: { values: {}, message: form.message } });
		await removeStaff(me, shop, form.data.staffId, clock());
		done('staff');
	},
	requestLink: async (event) => {
		const { me, shop } = await actingFor(event);
		const form = await parseForm(event.request, linkRequestSchema);
		if (!form.ok) return fail(400, { link: { values: form.values, message: form.message } });
		const refused = await kept('link', form.values, () =>
			requestLink(me, shop, form.data, clock())
		);
		if (refused) return refused;
		done('links');
	},
	offerHandover: async (event) => {
		const { me, shop } = await actingFor(event);
		const form = await parseForm(event.request, transferSchema);
		if (!form.ok) return fail(400, { handover: { values: form.values, message: form.message } });
		const refused = await kept('handover', form.values, () =>
			offerHandover(me, shop, form.data, clock())
		);
		if (refused) return refused;
		done('handovers');
	},
	withdrawHandover: async (event) => {
		const { me, shop } = await actingFor(event);
		const form = await parseForm(event.request, transferRefSchema);
		if (!form.ok) return fail(400, { handover: { values: {}, message: form.message } });
		await withdrawHandover(me, shop, form.data.transferId, clock());
		done('handovers');
	},
	reply: async (event) => {
		const { me, shop } = await actingFor(event);
		const form = await parseForm(event.request, replySchema);
		if (!form.ok)
			return fail(400, {
				reply: {
					id: Number(form.values.messageId) || 0,
					values: form.values,
					message: form.message
				}
			});
		await replyToMessage(me, shop, form.data.messageId, form.data.reply, clock());
		done('messages');
	}
});
