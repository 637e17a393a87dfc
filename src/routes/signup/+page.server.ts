import { fail, redirect } from '@sveltejs/kit';
import { message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { signUp } from '$lib/server/accounts/flows';
import { mailRequests, take } from '$lib/server/auth/limits';
import { signUpSchema } from '$lib/schemas/account';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals }) => {
	if (locals.user) redirect(303, '/profile');
	return { form: await superValidate(zod4(signUpSchema)) };
};

export const actions: Actions = {
	default: async ({ request, getClientAddress }) => {
		const form = await superValidate(request, zod4(signUpSchema));
		const { password } = form.data;
		form.data.password = '';
		form.data.confirm = '';
		if (!form.valid) return fail(400, { form });
		if (!(await take(mailRequests, `signup:${getClientAddress()}`))) {
			return message(form, 'Too many sign-ups from here in the last hour. Try again later.', {
				status: 429
			});
		}
		await signUp({ name: form.data.name, email: form.data.email, password });
		redirect(303, '/signup/check-mail');
	}
};
