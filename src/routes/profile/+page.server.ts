import { fail, redirect } from '@sveltejs/kit';
import { endAllSessions } from '$lib/server/auth/sessions';
import { message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import * as users from '$lib/server/db/users';
import { requireUser } from '$lib/server/guard';
import { profileSchema } from '$lib/schemas/account';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const me = requireUser(event);
	const row = await users.read(me.id);
	const form = await superValidate(
		{
			name: row?.name ?? me.name,
			units: row?.units ?? 'metric',
			mailComments: row?.mailComments ?? true,
			mailShop: row?.mailShop ?? true,
			mailNews: row?.mailNews ?? false
		},
		zod4(profileSchema)
	);
	return { form, email: me.email, role: me.role };
};

export const actions: Actions = {
	save: async (event) => {
		const me = requireUser(event);
		const form = await superValidate(event.request, zod4(profileSchema));
		if (!form.valid) return fail(400, { form });
		await users.update(me.id, form.data);
		return message(form, 'Saved.');
	},
	signOutEverywhere: async (event) => {
		const me = requireUser(event);
		await endAllSessions(me.id);
		redirect(303, '/signin?ended');
	}
};
