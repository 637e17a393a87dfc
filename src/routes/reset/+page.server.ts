import { fail } from '@sveltejs/kit';
import { message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { requestReset } from '$lib/server/accounts/flows';
import { mailRequests, take } from '$lib/server/auth/limits';
import { resetRequestSchema } from '$lib/schemas/account';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async () => ({
	form: await superValidate(zod4(resetRequestSchema))
});

export const actions: Actions = {
	default: async ({ request }) => {
		const form = await superValidate(request, zod4(resetRequestSchema));
		if (!form.valid) return fail(400, { form });
		if (!(await take(mailRequests, `reset:${form.data.email.toLowerCase()}`))) {
			return message(form, 'We have sent several reset mails to this address; wait an hour.', {
				status: 429
			});
		}
		await requestReset(form.data.email);
		return message(
			form,
			'If that address has an account, a reset link is on its way. It works for one hour.'
		);
	}
};
