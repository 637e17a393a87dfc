import { photoOrderSchema } from '$lib/schemas/sheet';
import { api, noContent, parse, readJson } from '$lib/server/api';
import { editBuild } from '$lib/server/sheet/access';
import { reorderPhotos } from '$lib/server/sheet/photos';
import type { RequestHandler } from './$types';

export const PUT: RequestHandler = api(async (event) => {
	const { build } = await editBuild(event, Number(event.params.id));
	const { ids } = parse(photoOrderSchema, await readJson(event.request));
	await reorderPhotos(build.id, ids);
	return noContent();
});
