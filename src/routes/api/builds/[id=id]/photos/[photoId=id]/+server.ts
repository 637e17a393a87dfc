import { error, json } from '@sveltejs/kit';
import { photoPatchSchema } from '$lib/schemas/sheet';
import { api, noContent, parse, readJson } from '$lib/server/api';
import { editBuild } from '$lib/server/sheet/access';
import { removePhoto, updatePhoto } from '$lib/server/sheet/photos';
import type { RequestHandler } from './$types';

export const PATCH: RequestHandler = api(async (event) => {
	const { build } = await editBuild(event, Number(event.params.id));
	const body = parse(photoPatchSchema, await readJson(event.request));
	if (!(await updatePhoto(build.id, Number(event.params.photoId), body)))
		error(404, 'No such photo.');
	return json({ ok: true });
});

export const DELETE: RequestHandler = api(async (event) => {
	const { build } = await editBuild(event, Number(event.params.id));
	if (!(await removePhoto(build.id, Number(event.params.photoId)))) error(404, 'No such photo.');
	return noContent();
});
