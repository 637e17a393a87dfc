import { error, json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/guard';
import { api, readJson } from '$lib/server/api';
import { createOnce } from '$lib/server/web/idempotency';
import * as runs from '$lib/server/sheet/runs';
import * as setups from '$lib/server/sheet/setups';
import { editBuild, readBuild } from '$lib/server/sheet/access';
import { sheetBody } from '$lib/server/sheet/api-bodies';
import { saveRun } from '$lib/server/sheet/service';
import { RUN_FIELDS } from '$lib/sheet/run-fields';
import type { RequestHandler } from './$types';

// The build page's setup history fetches its runs from here in the browser.
export const GET: RequestHandler = api(async (event) => {
	const { build } = await readBuild(event, Number(event.params.id));
	const setup = await setups.read(build.id, Number(event.params.setupId));
	if (!setup) error(404, 'No such setup.');
	const rows = (await runs.listForBuild(build.id)).filter((r) => r.setupId === setup.id);
	return json({ runs: rows.map((r) => r.get({ plain: true })) });
});

export const POST: RequestHandler = api(async (event) => {
	const { build } = await editBuild(event, Number(event.params.id));
	const setup = await setups.read(build.id, Number(event.params.setupId));
	if (!setup) error(404, 'No such setup.');
	const body = await readJson(event.request);
	const stored = sheetBody('run', RUN_FIELDS, body, 'complete');
	return createOnce(event.request, requireUser(event).id, body, () =>
		saveRun(build.id, setup.id, stored)
	);
});
