import { fail, redirect } from '@sveltejs/kit';
import { Failure } from '$lib/failure';
import { proposeScooterSchema } from '$lib/schemas/scooters';
import { requireUser } from '$lib/server/guard';
import { familyChoices } from '$lib/server/scooters/catalogue';
import { proposeScooter } from '$lib/server/scooters/proposals';
import { parseForm } from '$lib/server/web/plain-form';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireUser(event);
	return { families: await familyChoices() };
};

export const actions: Actions = {
	propose: async (event) => {
		const me = requireUser(event);
		const form = await parseForm(event.request, proposeScooterSchema);
		if (!form.ok) return fail(400, { values: form.values, message: form.message });
		try {
			const id = await proposeScooter(me, form.data);
			redirect(303, `/scooters/${id}`);
		} catch (e) {
			if (e instanceof Failure) return fail(e.status, { values: form.values, message: e.message });
			throw e;
		}
	}
};
