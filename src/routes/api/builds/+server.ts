import { json } from '@sveltejs/kit';
import { api, created, parse, readJson } from '$lib/server/api';
import * as builds from '$lib/server/sheet/builds';
import { listBuilds } from '$lib/server/search/build-list';
import { currencyFor, unitsFor } from '$lib/server/sheet/units';
import { buildListSchema } from '$lib/schemas/build-list';
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
	const stored = sheetBody('build', BUILD_FIELDS, await readJson(event.request), 'draft');
	const b = await builds.create(me.id, {
		...(stored as builds.BuildPatch),
		title: String(stored.title)
	});
	return created({ id: b.id, version: b.version, publication: b.publication });
});
