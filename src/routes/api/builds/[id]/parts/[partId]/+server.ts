import { api, noContent } from '$lib/server/api';
import { editBuild, idParam } from '$lib/server/sheets/access';
import { removePart } from '$lib/server/sheets/service';
import type { RequestHandler } from './$types';

export const DELETE: RequestHandler = api(async (event) => {
	const { build } = await editBuild(event, idParam(event.params.id));
	await removePart(build.id, Number(event.params.partId));
	return noContent();
});
