import { fail, redirect } from '@sveltejs/kit';
import { message } from 'sveltekit-superforms';
import * as runs from '$lib/server/sheet/runs';
import { editRun } from '$lib/server/sheet/access';
import { CONFLICT, readSheetForm, sheetForm } from '$lib/server/sheet/forms';
import { recomputeBuild, recomputeSetup } from '$lib/server/derived/recompute';
import { runFromColumns, saveRun } from '$lib/server/sheet/service';
import { unitsFor } from '$lib/server/sheet/units';
import { RUN_FIELDS } from '$lib/sheet/run-fields';
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
		const { form, stored, version } = await readSheetForm(
			event.request,
			'run',
			RUN_FIELDS,
			'complete'
		);
		if (!form.valid) return fail(400, { form });
		const r = await saveRun(build.id, run.setupId, stored, { id: run.id, version });
		if ('conflict' in r) return message(form, CONFLICT, { status: 409 });
		redirect(303, `/builds/${build.id}/edit`);
	},
	remove: async (event) => {
		const { build, run } = await editRun(event);
		await runs.destroy(run.id);
		await recomputeSetup(run.setupId);
		await recomputeBuild(build.id);
		redirect(303, `/builds/${build.id}/edit`);
	}
};
