import { json } from '@sveltejs/kit';
import { api, parse, readJson } from '$lib/server/api';
import { createBuild } from '$lib/server/sheet/build-service';
import { createOnce } from '$lib/server/web/idempotency';
import { listBuilds } from '$lib/server/search/build-list';
import { currencyFor, unitsFor } from '$lib/server/sheet/units';
import { buildListSchema } from '$lib/schemas/build-list';
import { startFromSchema } from '$lib/schemas/scooters';
import { requireUser } from '$lib/server/guard';
import { sheetBody } from '$lib/server/sheet/api-bodies';
import { BUILD_FIELDS } from '$lib/sheet/fields';
import type { RequestHandler } from './$types';

// Public list of published sheets: the same filters, search and keyset pages as /builds.
export const GET: RequestHandler = api(async (event) => {
	const q = parse(buildListSchema, Object.fromEntries(event.url.searchParams));
	if (q.sort === 'cheapest') q.currency ??= currencyFor(event);
	return json(await listBuilds(q, unitsFor(event)));
});

export const POST: RequestHandler = api(async (event) => {
	const me = requireUser(event);
	const body = await readJson(event.request);
	const stored = sheetBody('build', BUILD_FIELDS, body, 'draft');
	const { baseScooterId } = parse(startFromSchema, body ?? {});
	return createOnce(event.request, me.id, body, async () => {
		const b = await createBuild(me.id, stored, baseScooterId);
		return { id: b.id, version: b.version, publication: b.publication };
	});
});
