import { fail, redirect } from '@sveltejs/kit';
import { editBuild } from '$lib/server/sheet/access';
import { readSheetForm, sheetForm } from '$lib/server/sheet/forms';
import { newSetupValues, saveSetup } from '$lib/server/sheet/service';
import { unitsFor } from '$lib/server/sheet/units';
import { requireUser } from '$lib/server/guard';
import { once } from '$lib/server/web/idempotency';
import { SETUP_FIELDS } from '$lib/sheet/setup-fields';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { build } = await editBuild(event, Number(event.params.id));
	const units = unitsFor(event);
	const values = await newSetupValues(build);
	return {
		units,
		build: { id: build.id, title: build.title },
		first: build.setupCount === 0,
		form: await sheetForm('setup', SETUP_FIELDS, units, values)
	};
};

export const actions: Actions = {
	create: async (event) => {
		const { build } = await editBuild(event, Number(event.params.id));
		const { form, stored } = await readSheetForm(event.request, 'setup', SETUP_FIELDS);
		if (!form.valid) return fail(400, { form });
		// The page's send queue sends a setup kept offline with a key: a resend makes nothing new.
		await once(event.request, requireUser(event).id, stored, () => saveSetup(build.id, stored));
		redirect(303, `/builds/${build.id}/edit`);
	}
};
