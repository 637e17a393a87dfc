import { fail } from '@sveltejs/kit';
import { clock } from '$lib/clock';
import { decideLink, inspectLinkToken } from '$lib/server/shops/links';
import { forPages } from '$lib/server/web/page-failure';
import type { Actions, PageServerLoad } from './$types';

// The link in the owner's mail stands for the owner, so no sign-in is needed. Opening it only
// shows the question; the answer takes a button press, so mail scanners cannot spend it.
export const load: PageServerLoad = async ({ params }) => {
	const check = await inspectLinkToken(params.token, clock());
	return { check };
};

export const actions: Actions = forPages({
	default: async ({ params }) => {
		const r = await decideLink({ token: params.token }, null, clock());
		if (!r.ok) return fail(400, { problem: r.problem });
		return { done: r.link };
	}
});
