import { fail, redirect } from '@sveltejs/kit';
import { confirmAddress } from '$lib/server/accounts/flows';
import * as tokens from '$lib/server/auth/email-tokens';
import type { Actions, PageServerLoad } from './$types';

// Confirming takes a button press (a POST) so mail scanners that open links do not spend the token.
export const load: PageServerLoad = async ({ params }) => ({
	check: await tokens.inspect(params.token, 'verify')
});

export const actions: Actions = {
	default: async ({ params }) => {
		const used = await confirmAddress(params.token);
		if (!used.ok) return fail(400, { problem: used.reason });
		redirect(303, '/signin?verified=1');
	}
};
