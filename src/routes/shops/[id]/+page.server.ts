import { error, fail } from '@sveltejs/kit';
import { messageSchema } from '$lib/schemas/shops';
import { clock } from '$lib/server/clock';
import { models } from '$lib/server/db/models';
import { requireUser } from '$lib/server/guard';
import { parseForm } from '$lib/server/plain-form';
import { MessageLimited, sendMessage } from '$lib/server/shops/messages';
import { summarise, viewShop } from '$lib/server/shops/pages';
import type { Actions, PageServerLoad } from './$types';

const shopId = (raw: string) => {
	const n = Number(raw);
	if (!Number.isInteger(n) || n <= 0) error(404, 'No such shop.');
	return n;
};

export const load: PageServerLoad = async (event) => {
	const me = event.locals.user;
	const { shop, acting } = await viewShop(shopId(event.params.id), me);
	const { ShopLink, Build } = models();
	const links = await ShopLink.findAll({
		where: { shopId: shop.id, state: 'approved' },
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
	const kindOf = new Map(links.map((l) => [l.buildId, l.kind]));
	return {
		shop: {
			id: shop.id,
			name: shop.name,
			region: shop.region,
			services: shop.services,
			openingNote: shop.openingNote,
			logo: shop.logoKey !== null,
			verified: shop.verifiedAt !== null,
			hidden: shop.moderation === 'hidden',
			hiddenReason: shop.hiddenReason
		},
		acting,
		summary: await summarise(shop.id),
		builds: rows.map((b) => ({
			id: b.id,
			title: b.title,
			kind: kindOf.get(b.id) ?? 'built',
			cc: b.repCc,
			bestKmh: b.bestSpeedKmh,
			partsMinor: b.partsTotalMinor,
			currency: b.currency
		})),
		canWrite: me !== null && !me.suspension && !acting,
		signedIn: me !== null,
		suspended: Boolean(me?.suspension)
	};
};

export const actions: Actions = {
	contact: async (event) => {
		const me = requireUser(event);
		const { shop, acting } = await viewShop(shopId(event.params.id), me);
		const form = await parseForm(event.request, messageSchema);
		if (!form.ok)
			return fail(400, { contact: { body: form.values.body ?? '', message: form.message } });
		if (acting)
			return fail(400, { contact: { body: form.data.body, message: 'That is your own shop.' } });
		try {
			await sendMessage(me, shop, form.data.body, event.getClientAddress(), clock());
		} catch (e) {
			if (e instanceof MessageLimited)
				return fail(429, { contact: { body: form.data.body, message: e.message } });
			throw e;
		}
		return { sent: true };
	}
};
