import { error, fail, redirect } from '@sveltejs/kit';
import * as setups from '$lib/server/db/setups';
import { editBuild, idParam } from '$lib/server/sheets/access';
import { readSheetForm, sheetForm } from '$lib/server/sheets/forms';
import { saveRun } from '$lib/server/sheets/service';
import { unitsFor } from '$lib/server/sheets/units';
import { RUN_FIELDS } from '$lib/sheet/run-fields';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

async function target(event: RequestEvent) {
	const { build } = await editBuild(event, idParam(event.params.id));
	const setup = await setups.read(build.id, Number(event.params.setupId));
	if (!setup) error(404, 'No such setup.');
	return { build, setup };
}

export const load: PageServerLoad = async (event) => {
	const { build, setup } = await target(event);
	const units = unitsFor(event);
	const today = new Date().toISOString().slice(0, 10);
	const form = await sheetForm(
		'run',
		RUN_FIELDS,
		units,
		{
			runOn: today,
			method: 'gps-logger',
			venue: 'closed-course',
			pressureKind: 'sea-level',
			chtSensor: 'plug-washer',
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
		const { build, setup } = await target(event);
		const { form, stored } = await readSheetForm(event.request, 'run', RUN_FIELDS, 'complete');
		if (!form.valid) return fail(400, { form });
		await saveRun(build.id, setup.id, stored);
		redirect(303, `/builds/${build.id}/edit`);
	}
};
