import { fail, redirect } from '@sveltejs/kit';
import { message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { resetPassword } from '$lib/server/accounts/flows';
import * as tokens from '$lib/server/auth/email-tokens';
import { newPasswordSchema } from '$lib/schemas/account';
import type { Actions, PageServerLoad } from './$types';

const REASONS = {
	used: 'This reset link was used already. Ask for a new one if you still need it.',
	expired: 'This reset link has expired (they last an hour). Ask for a new one.',
	unknown: 'We do not recognise this reset link. Check it was copied whole, or ask for a new one.'
} as const;

export const load: PageServerLoad = async ({ params }) => {
	const check = await tokens.inspect(params.token, 'reset');
	return {
		problem: check.ok ? null : REASONS[check.reason],
		form: await superValidate(zod4(newPasswordSchema))
	};
};

export const actions: Actions = {
	default: async ({ request, params }) => {
		const form = await superValidate(request, zod4(newPasswordSchema));
		const { password } = form.data;
		form.data.password = '';
		form.data.confirm = '';
		if (!form.valid) return fail(400, { form });
		const used = await resetPassword(params.token, password);
		if (!used.ok) return message(form, REASONS[used.reason], { status: 400 });
		redirect(303, '/signin?reset=1');
	}
};
