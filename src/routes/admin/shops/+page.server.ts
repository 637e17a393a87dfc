import { fail } from '@sveltejs/kit';
import { shopCheckSchema } from '$lib/schemas/shops';
import { clock } from '$lib/clock';
import { requireRole } from '$lib/server/guard';
import { setVerified, shopsForCheck } from '$lib/server/shops/pages';
import { parseForm } from '$lib/server/web/plain-form';
import { forPages } from '$lib/server/web/page-failure';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'admin');
	const show = event.url.searchParams.get('show') === 'all' ? 'all' : 'waiting';
	const sort = event.url.searchParams.get('sort') === 'name' ? 'name' : 'oldest';
	return { show, sort, shops: await shopsForCheck({ show, sort }) };
};

export const actions: Actions = forPages({
	verify: async (event) => {
		const me = requireRole(event, 'admin');
		const form = await parseForm(event.request, shopCheckSchema);
		if (!form.ok) return fail(400, { message: form.message });
		await setVerified(me, form.data.shopId, true, form.data.note, clock());
		return { message: 'Stamped as a verified shop and logged.' };
	},
	unverify: async (event) => {
		const me = requireRole(event, 'admin');
		const form = await parseForm(event.request, shopCheckSchema);
		if (!form.ok) return fail(400, { message: form.message });
		if (!form.data.note) return fail(400, { message: 'Say why the stamp is withdrawn.' });
		await setVerified(me, form.data.shopId, false, form.data.note, clock());
		return { message: 'Verification withdrawn and logged.' };
	}
});
