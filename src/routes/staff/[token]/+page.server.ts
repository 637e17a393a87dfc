import { fail } from '@sveltejs/kit';
import { clock } from '$lib/clock';
import { requireUser } from '$lib/server/guard';
import { checkToken } from '$lib/server/shops/tokens';
import { joinStaff } from '$lib/server/shops/staff';
import { forPages } from '$lib/server/web/page-failure';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireUser(event);
	const c = checkToken('shop-staff', event.params.token, clock());
	return { problem: c.ok ? null : c.problem };
};

export const actions: Actions = forPages({
	default: async (event) => {
		const me = requireUser(event);
		const r = await joinStaff(me, event.params.token, clock());
		if (!r.ok) return fail(400, { problem: r.problem });
		return { joined: r.shopName };
	}
});
