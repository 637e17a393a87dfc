import { Failure } from '$lib/failure';
import { fail } from '@sveltejs/kit';
import { messageSchema } from '$lib/schemas/shops';
import { clock } from '$lib/clock';
import { requireUser } from '$lib/server/guard';
import { parseForm } from '$lib/server/web/plain-form';
import { sendMessage } from '$lib/server/shops/messages';
import { viewShop } from '$lib/server/shops/access';
import { linkedBuilds, shopView } from '$lib/server/shops/pages';
import { summarise } from '$lib/shops/summary';
import { forPages } from '$lib/server/web/page-failure';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const me = event.locals.user;
	const { shop, acting } = await viewShop(Number(event.params.id), me);
	const builds = await linkedBuilds(shop.id);
	return {
		shop: shopView(shop),
		acting,
		summary: summarise(builds),
		builds,
		canWrite: me !== null && !me.suspension && !acting,
		signedIn: me !== null,
		suspended: Boolean(me?.suspension)
	};
};

export const actions: Actions = forPages({
	contact: async (event) => {
		const me = requireUser(event);
		const { shop, acting } = await viewShop(Number(event.params.id), me);
		const form = await parseForm(event.request, messageSchema);
		if (!form.ok)
			return fail(400, { contact: { body: form.values.body ?? '', message: form.message } });
		if (acting)
			return fail(400, { contact: { body: form.data.body, message: 'That is your own shop.' } });
		try {
			await sendMessage(me, shop, form.data.body, event.getClientAddress(), clock());
		} catch (e) {
			if (e instanceof Failure)
				return fail(e.status, { contact: { body: form.data.body, message: e.message } });
			throw e;
		}
		return { sent: true };
	}
});
