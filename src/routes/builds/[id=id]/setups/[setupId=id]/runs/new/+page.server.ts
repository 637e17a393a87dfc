import { fail, redirect } from '@sveltejs/kit';
import { editSetup } from '$lib/server/sheet/access';
import { readSheetForm, sheetForm } from '$lib/server/sheet/forms';
import { saveRun } from '$lib/server/sheet/service';
import { unitsFor } from '$lib/server/sheet/units';
import { RUN_FIELDS } from '$lib/sheet/run-fields';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { build, setup } = await editSetup(event);
	const units = unitsFor(event);
	const today = new Date().toISOString().slice(0, 10);
	const form = await sheetForm(
		'run',
		RUN_FIELDS,
		units,
		{
			runOn: today,
			humidity: 50
		},
		'complete'
	);
	return {
		units,
		form,
		build: { id: build.id, title: build.title },
		setup: { id: setup.id, position: setup.position, changeNote: setup.changeNote }
	};
};

export const actions: Actions = {
	create: async (event) => {
		const { build, setup } = await editSetup(event);
		const { form, stored } = await readSheetForm(event.request, 'run', RUN_FIELDS, 'complete');
		if (!form.valid) return fail(400, { form });
		await saveRun(build.id, setup.id, stored);
		redirect(303, `/builds/${build.id}/edit`);
	}
};
