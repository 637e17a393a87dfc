import { api, created, readJson } from '$lib/server/api';
import { requireUser } from '$lib/server/guard';
import { importBuild } from '$lib/server/sheet/export';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = api(async (event) => {
	const me = requireUser(event);
	const id = await importBuild(me.id, await readJson(event.request, 5 * 1024 * 1024));
	return created({ id, publication: 'draft' });
});
