import { json } from '@sveltejs/kit';
import { api, noContent, readJson } from '$lib/server/api';
import * as builds from '$lib/server/sheet/builds';
import { destroyBuild, saveBuild } from '$lib/server/sheet/build-service';
import { editBuild, readBuild, seesTakenDown } from '$lib/server/sheet/access';
import { sheetBody, versionOf } from '$lib/server/sheet/api-bodies';
import { exportBuild } from '$lib/server/sheet/export';
import { BUILD_FIELDS } from '$lib/sheet/fields';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = api(async (event) => {
	const { build } = await readBuild(event, Number(event.params.id));
	return json({
		id: build.id,
		version: build.version,
		publication: build.publication,
		sheet: await exportBuild(build, { withTakenDown: seesTakenDown(event, build) })
	});
});

export const PATCH: RequestHandler = api(async (event) => {
	const { build } = await editBuild(event, Number(event.params.id));
	const body = await readJson(event.request);
	const version = versionOf(body);
	const stored = sheetBody(
		'build',
		BUILD_FIELDS,
		{ ...(await fullBuild(build.id)), ...(body as object) },
		'draft'
	);
	return json(await saveBuild(build.id, version, stored));
});

export const DELETE: RequestHandler = api(async (event) => {
	const { build } = await editBuild(event, Number(event.params.id));
	await destroyBuild(build.id);
	return noContent();
});

/** PATCH is partial: the stored values fill whatever the body leaves out. */
async function fullBuild(id: number) {
	const b = await builds.read(id);
	return Object.fromEntries(BUILD_FIELDS.map((f) => [f.name, b?.get(f.name as never)]));
}
