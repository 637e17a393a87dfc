import { fail, redirect } from '@sveltejs/kit';
import * as builds from '$lib/server/db/builds';
import { requireUser } from '$lib/server/guard';
import { readSheetForm, sheetForm } from '$lib/server/sheets/forms';
import { unitsFor } from '$lib/server/sheets/units';
import { BUILD_FIELDS } from '$lib/sheet/fields';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireUser(event);
	const units = unitsFor(event);
	return {
		units,
		form: await sheetForm('build', BUILD_FIELDS, units, {
			engineCycle: 'two-stroke',
			cooling: 'air',
			cylinderOrientation: 'horizontal',
			currency: 'EUR'
		})
	};
};

export const actions: Actions = {
	create: async (event) => {
		const me = requireUser(event);
		const { form, stored } = await readSheetForm(event.request, 'build', BUILD_FIELDS);
		if (!form.valid) return fail(400, { form });
		const b = await builds.create(me.id, {
			...(stored as builds.BuildPatch),
			title: String(stored.title)
		});
		redirect(303, `/builds/${b.id}/setups/new`);
	}
};
