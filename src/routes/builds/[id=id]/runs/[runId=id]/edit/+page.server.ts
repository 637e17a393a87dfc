import { fail, redirect } from '@sveltejs/kit';
import { editRun } from '$lib/server/sheet/access';
import { readSheetForm, sheetForm } from '$lib/server/sheet/forms';
import { removeRun, runFromColumns, saveRun } from '$lib/server/sheet/service';
import { formFailure } from '$lib/server/web/form-failure';
import { unitsFor } from '$lib/server/sheet/units';
import { RUN_FIELDS } from '$lib/sheet/run-fields';
import { toForm } from '$lib/sheet/schema';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { build, run } = await editRun(event);
	const units = unitsFor(event);
	const form = await sheetForm('run', RUN_FIELDS, units, runFromColumns(run), 'complete');
	return {
		units,
		form,
		build: { id: build.id, title: build.title },
		run: { id: run.id, version: run.version }
	};
};

export const actions: Actions = {
	save: async (event) => {
		const { build, run } = await editRun(event);
		const { form, stored, version, units } = await readSheetForm(
			event.request,
			'run',
			RUN_FIELDS,
			'complete'
		);
		if (!form.valid) return fail(400, { form });
		try {
			await saveRun(build.id, run.setupId, stored, { id: run.id, version });
		} catch (e) {
			const values = toForm(RUN_FIELDS, runFromColumns(run), units);
			return formFailure(form, e, { values, version: run.version });
		}
		redirect(303, `/builds/${build.id}/edit`);
	},
	remove: async (event) => {
		const { build, run } = await editRun(event);
		await removeRun(build.id, run);
		redirect(303, `/builds/${build.id}/edit`);
	}
};
