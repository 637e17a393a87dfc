import { fail, redirect } from '@sveltejs/kit';
import { Failure } from '$lib/failure';
import { accountDeleteSchema } from '$lib/schemas/shops';
import { deleteAccount } from '$lib/server/accounts/deletion';
import { clock } from '$lib/clock';
import * as builds from '$lib/server/sheet/builds';
import { ownShop } from '$lib/server/shops/pages';
import { requireUser } from '$lib/server/guard';
import { parseForm } from '$lib/server/web/plain-form';
import { forPages } from '$lib/server/web/page-failure';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const me = requireUser(event);
	const own = await builds.listBench(me.id);
	const shop = await ownShop(me.id);
	return {
		email: me.email,
		builds: own.length,
		published: own.filter((b) => b.publication === 'published').length,
		shopName: shop?.name ?? null
	};
};

export const actions: Actions = forPages({
	// A suspended member may still leave: deleting is not posting.
	default: async (event) => {
		const me = requireUser(event, { evenSuspended: true });
		const form = await parseForm(event.request, accountDeleteSchema);
		if (!form.ok) return fail(400, { values: form.values, message: form.message });
		try {
			await deleteAccount(me, form.data.mode, clock());
		} catch (e) {
			if (e instanceof Failure && e.status === 409)
				return fail(409, { values: form.values, message: e.message });
			throw e;
		}
		// The session cookie names Auth.js uses over plain HTTP and over HTTPS.
		for (const name of ['authjs.session-token', '__Secure-authjs.session-token'])
			event.cookies.delete(name, { path: '/' });
		redirect(303, '/?account=deleted');
	}
});
