import { json } from '@sveltejs/kit';
import { api, noContent, readJson } from '$lib/server/api';
import { editBuild } from '$lib/server/sheet/access';
import { partBody } from '$lib/server/sheet/api-bodies';
import { removePart, updatePart } from '$lib/server/sheet/service';
import type { RequestHandler } from './$types';

/** The whole part, as POST on the list takes it. */
export const PUT: RequestHandler = api(async (event) => {
	const { build } = await editBuild(event, Number(event.params.id));
	const stored = partBody(await readJson(event.request));
	await updatePart(build.id, Number(event.params.partId), stored);
	return json({ ok: true });
});

export const DELETE: RequestHandler = api(async (event) => {
	const { build } = await editBuild(event, Number(event.params.id));
	await removePart(build.id, Number(event.params.partId));
	return noContent();
});
