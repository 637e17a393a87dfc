import { fail } from '@sveltejs/kit';
import { message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { resendConfirmation } from '$lib/server/accounts/flows';
import { mailRequests, take } from '$lib/server/auth/limits';
import { resetRequestSchema as addressSchema } from '$lib/schemas/account';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async () => ({
	form: await superValidate(zod4(addressSchema))
});

export const actions: Actions = {
	default: async ({ request }) => {
		const form = await superValidate(request, zod4(addressSchema));
		if (!form.valid) return fail(400, { form });
		if (!(await take(mailRequests, `verify:${form.data.email.toLowerCase()}`))) {
			return message(form, 'We have sent several mails to this address; wait an hour.', {
				status: 429
			});
		}
		await resendConfirmation(form.data.email);
		return message(
			form,
			'If that address joined and is not confirmed yet, a new confirmation link is on its way. It works for 48 hours.'
		);
	}
};
