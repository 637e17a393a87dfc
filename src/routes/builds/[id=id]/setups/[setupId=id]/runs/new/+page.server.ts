import { fail, redirect } from '@sveltejs/kit';
import { editSetup } from '$lib/server/sheet/access';
import { readSheetForm, sheetForm } from '$lib/server/sheet/forms';
import { carriedRunValues, saveRun } from '$lib/server/sheet/service';
import { unitsFor } from '$lib/server/sheet/units';
import { requireUser } from '$lib/server/guard';
import { once } from '$lib/server/web/idempotency';
import { RUN_FIELDS } from '$lib/sheet/run-fields';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { build, setup } = await editSetup(event);
	const units = unitsFor(event);
	const today = new Date().toISOString().slice(0, 10);
	const carried = await carriedRunValues(build.id);
	const form = await sheetForm(
		'run',
		RUN_FIELDS,
		units,
		{ humidity: 50, ...carried.values, runOn: today },
		'complete'
	);
	// The speed starts empty, never 0: it is the one thing that is new about every run.
	delete (form.data as Record<string, unknown>).speed;
	return {
		units,
		form,
		carriedFrom: carried.from,
		carriedFields: Object.keys(carried.values),
		build: { id: build.id, title: build.title },
		setup: { id: setup.id, position: setup.position, changeNote: setup.changeNote }
	};
};

export const actions: Actions = {
	create: async (event) => {
		const { build, setup } = await editSetup(event);
		const { form, stored } = await readSheetForm(event.request, 'run', RUN_FIELDS, 'complete');
		if (!form.valid) return fail(400, { form });
		// The page's send queue sends a run kept offline with a key: a resend makes nothing new.
		await once(event.request, requireUser(event).id, stored, () =>
			saveRun(build.id, setup.id, stored)
		);
		redirect(303, `/builds/${build.id}/edit`);
	}
};
