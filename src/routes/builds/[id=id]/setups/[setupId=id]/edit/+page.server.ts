import { fail, redirect } from '@sveltejs/kit';
import { editSetup } from '$lib/server/sheet/access';
import { readSheetForm, sheetForm } from '$lib/server/sheet/forms';
import { removeSetup, saveSetup } from '$lib/server/sheet/service';
import { formFailure } from '$lib/server/web/form-failure';
import { unitsFor } from '$lib/server/sheet/units';
import { toForm } from '$lib/sheet/schema';
import { SETUP_FIELDS } from '$lib/sheet/setup-fields';
import type { Actions, PageServerLoad } from './$types';

const asStored = (setup: { config: object; changeNote: string; isStock: boolean }) => ({
	...setup.config,
	changeNote: setup.changeNote,
	isStock: setup.isStock
});

export const load: PageServerLoad = async (event) => {
	const { build, setup } = await editSetup(event);
	const units = unitsFor(event);
	const form = await sheetForm('setup', SETUP_FIELDS, units, asStored(setup));
	return {
		units,
		form,
		build: { id: build.id, title: build.title },
		setup: { id: setup.id, position: setup.position, version: setup.version }
	};
};

export const actions: Actions = {
	save: async (event) => {
		const { build, setup } = await editSetup(event);
		const { form, stored, version, units } = await readSheetForm(
			event.request,
			'setup',
			SETUP_FIELDS
		);
		if (!form.valid) return fail(400, { form });
		try {
			await saveSetup(build.id, stored, { id: setup.id, version });
		} catch (e) {
			const values = toForm(SETUP_FIELDS, asStored(setup), units);
			return formFailure(form, e, { values, version: setup.version });
		}
		redirect(303, `/builds/${build.id}/edit`);
	},
	remove: async (event) => {
		const { build, setup } = await editSetup(event);
		await removeSetup(build.id, setup.id);
		redirect(303, `/builds/${build.id}/edit`);
	}
};
