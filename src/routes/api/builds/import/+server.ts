import { api, readJson } from '$lib/server/api';
import { createOnce } from '$lib/server/web/idempotency';
import { requireUser } from '$lib/server/guard';
import { importBuild } from '$lib/server/sheet/export';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = api(async (event) => {
	const me = requireUser(event);
	const body = await readJson(event.request, 5 * 1024 * 1024);
	return createOnce(event.request, me.id, body, async () => ({
		id: await importBuild(me.id, body),
		publication: 'draft'
	}));
});
