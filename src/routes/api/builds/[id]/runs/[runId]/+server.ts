import { error, json } from '@sveltejs/kit';
import { api, ApiFailure, noContent, readJson } from '$lib/server/api';
import * as runs from '$lib/server/db/runs';
import { editBuild, idParam } from '$lib/server/sheets/access';
import { sheetBody, versionOf } from '$lib/server/sheets/api-bodies';
import { recomputeBuild, recomputeSetup } from '$lib/server/sheets/recompute';
import { runFromColumns, saveRun } from '$lib/server/sheets/service';
import { RUN_FIELDS } from '$lib/sheet/run-fields';
import type { RequestEvent, RequestHandler } from './$types';

async function target(event: RequestEvent) {
	const { build } = await editBuild(event, idParam(event.params.id));
	const run = await runs.read(build.id, Number(event.params.runId));
	if (!run) error(404, 'No such run.');
	return { build, run };
}

export const PATCH: RequestHandler = api(async (event) => {
	const { build, run } = await target(event);
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
	const { build, run } = await target(event);
	await runs.destroy(run.id);
	await recomputeSetup(run.setupId);
	await recomputeBuild(build.id);
	return noContent();
});
