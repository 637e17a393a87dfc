import { fail, redirect } from '@sveltejs/kit';
import { endAllSessions } from '$lib/server/auth/sessions';
import { message, setError, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import * as users from '$lib/server/auth/users';
import { requireUser } from '$lib/server/guard';
import { changePassword } from '$lib/server/accounts/flows';
import { changePasswordSchema, profileSchema } from '$lib/schemas/account';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const me = requireUser(event);
	const row = await users.read(me.id);
	const form = await superValidate(
		{
			name: row?.name ?? me.name,
			units: row?.units ?? 'metric',
			theme: row?.theme ?? 'device',
			mailComments: row?.mailComments ?? true,
			mailShop: row?.mailShop ?? true
		},
		zod4(profileSchema)
	);
	const passwordForm = await superValidate(zod4(changePasswordSchema), { id: 'password' });
	return {
		form,
		passwordForm,
		hasPassword: Boolean(row?.passwordHash),
		email: me.email,
		role: me.role
	};
};

export const actions: Actions = {
	save: async (event) => {
		const me = requireUser(event);
		const form = await superValidate(event.request, zod4(profileSchema));
		if (!form.valid) return fail(400, { form });
		await users.update(me.id, form.data);
		return message(form, 'Saved.');
	},
	password: async (event) => {
		const me = requireUser(event);
		const form = await superValidate(event.request, zod4(changePasswordSchema), { id: 'password' });
		if (!form.valid) return fail(400, { passwordForm: form });
		const r = await changePassword(me.id, form.data.current, form.data.password);
		if (!r.ok) return setError(form, r.field, r.message);
		// Every session ended with the old password, this one too: sign in with the new one.
		redirect(303, '/signin?password-changed');
	},
	signOutEverywhere: async (event) => {
		const me = requireUser(event);
		await endAllSessions(me.id);
		redirect(303, '/signin?ended');
	}
};
