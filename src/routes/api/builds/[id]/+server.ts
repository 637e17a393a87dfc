import { json } from '@sveltejs/kit';
import { api, ApiFailure, noContent, readJson } from '$lib/server/api';
import * as builds from '$lib/server/sheet/builds';
import { editBuild, idParam, readBuild, seesTakenDown } from '$lib/server/sheet/access';
import { sheetBody, versionOf } from '$lib/server/sheet/api-bodies';
import { exportBuild } from '$lib/server/sheet/export';
import { refreshListing } from '$lib/server/derived/recompute';
import { destroyBuild } from '$lib/server/sheet/remove';
import { BUILD_FIELDS } from '$lib/sheet/fields';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = api(async (event) => {
	const { build } = await readBuild(event, idParam(event.params.id));
	return json({
		id: build.id,
		version: build.version,
		publication: build.publication,
		sheet: await exportBuild(build, { withTakenDown: seesTakenDown(event, build) })
	});
});

export const PATCH: RequestHandler = api(async (event) => {
	const { build } = await editBuild(event, idParam(event.params.id));
	const body = await readJson(event.request);
	const version = versionOf(body);
	const stored = sheetBody(
		'build',
		BUILD_FIELDS,
		{ ...(await fullBuild(build.id)), ...(body as object) },
		'draft'
	);
	if (!(await builds.update(build.id, version, stored as builds.BuildPatch)))
		throw new ApiFailure(409, 'The build changed since that version; fetch it again.');
	await refreshListing(build.id);
	return json({ id: build.id, version: version + 1 });
});

export const DELETE: RequestHandler = api(async (event) => {
	const { build } = await editBuild(event, idParam(event.params.id));
	await destroyBuild(build.id);
	return noContent();
});

/** PATCH is partial: the stored values fill whatever the body leaves out. */
async function fullBuild(id: number) {
	const b = await builds.read(id);
	return Object.fromEntries(BUILD_FIELDS.map((f) => [f.name, b?.get(f.name as never)]));
}
