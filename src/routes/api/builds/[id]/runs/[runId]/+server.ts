import { json } from '@sveltejs/kit';
import { api, ApiFailure, noContent, readJson } from '$lib/server/api';
import * as runs from '$lib/server/sheet/runs';
import { editRun } from '$lib/server/sheet/access';
import { sheetBody, versionOf } from '$lib/server/sheet/api-bodies';
import { recomputeBuild, recomputeSetup } from '$lib/server/derived/recompute';
import { runFromColumns, saveRun } from '$lib/server/sheet/service';
import { RUN_FIELDS } from '$lib/sheet/run-fields';
import type { RequestHandler } from './$types';

export const PATCH: RequestHandler = api(async (event) => {
	const { build, run } = await editRun(event);
	const body = await readJson(event.request);
	const version = versionOf(body);
	const merged = Object.fromEntries(
		Object.entries({ ...runFromColumns(run), ...(body as object) }).filter(([, v]) => v !== null)
	);
	const r = await saveRun(build.id, run.setupId, sheetBody('run', RUN_FIELDS, merged, 'complete'), {
		id: run.id,
		version
	});
	if ('conflict' in r)
		throw new ApiFailure(409, 'The run changed since that version; fetch it again.');
	return json({ id: run.id, version: version + 1 });
});

export const DELETE: RequestHandler = api(async (event) => {
	const { build, run } = await editRun(event);
	await runs.destroy(run.id);
	await recomputeSetup(run.setupId);
	await recomputeBuild(build.id);
	return noContent();
});
