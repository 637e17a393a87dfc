import { json } from '@sveltejs/kit';
import { api, noContent, readJson } from '$lib/server/api';
import { editRun } from '$lib/server/sheet/access';
import { sheetBody, versionOf } from '$lib/server/sheet/api-bodies';
import { removeRun, runFromColumns, saveRun } from '$lib/server/sheet/service';
import { RUN_FIELDS } from '$lib/sheet/run-fields';
import type { RequestHandler } from './$types';

export const PATCH: RequestHandler = api(async (event) => {
	const { build, run } = await editRun(event);
	const body = await readJson(event.request);
	const version = versionOf(body);
	const merged = Object.fromEntries(
		Object.entries({ ...runFromColumns(run), ...(body as object) }).filter(([, v]) => v !== null)
	);
	await saveRun(build.id, run.setupId, sheetBody('run', RUN_FIELDS, merged, 'complete'), {
		id: run.id,
		version
	});
	return json({ id: run.id, version: version + 1 });
});

export const DELETE: RequestHandler = api(async (event) => {
	const { build, run } = await editRun(event);
	await removeRun(build.id, run);
	return noContent();
});
