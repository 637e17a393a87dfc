import { fail } from '@sveltejs/kit';
import { message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import * as deskNotes from '$lib/server/db/desk-notes';
import { requireRole } from '$lib/server/guard';
import { deskNoteSchema } from '$lib/schemas/desk';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'moderator');
	const [notes, form] = await Promise.all([deskNotes.list(), superValidate(zod4(deskNoteSchema))]);
	return { notes, form };
};

export const actions: Actions = {
	note: async (event) => {
		const me = requireRole(event, 'moderator');
		const form = await superValidate(event.request, zod4(deskNoteSchema));
		if (!form.valid) return fail(400, { form });
		await deskNotes.create(me.id, form.data.body);
		form.data.body = '';
		return message(form, 'Note pinned to the desk.');
	}
};
