import { fail } from '@sveltejs/kit';
import { clock } from '$lib/clock';
import { requireUser } from '$lib/server/guard';
import { acceptHandover, inspectHandover } from '$lib/server/shops/transfers';
import { forPages } from '$lib/server/web/page-failure';
import type { Actions, PageServerLoad } from './$types';

// Accepting a build needs the customer signed in with the offered address: the sheet moves to
// that account. Looking changes nothing; the button does.
export const load: PageServerLoad = async (event) => {
	const me = requireUser(event);
	return { check: await inspectHandover(event.params.token, clock()), email: me.email };
};

export const actions: Actions = forPages({
	default: async (event) => {
		const me = requireUser(event);
		const r = await acceptHandover(me, { token: event.params.token }, clock());
		if (!r.ok) return fail(400, { problem: r.problem });
		return { done: r.handover };
	}
});
