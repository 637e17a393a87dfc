import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { api, created, parse, readJson } from '$lib/server/api';
import * as builds from '$lib/server/db/builds';
import { requireUser } from '$lib/server/guard';
import { sheetBody } from '$lib/server/sheets/api-bodies';
import { BUILD_FIELDS } from '$lib/sheet/fields';
import type { RequestHandler } from './$types';

const query = z.object({
	cycle: z.enum(['two-stroke', 'four-stroke']).optional(),
	exhaust: z.enum(['stock', 'sport', 'expansion-chamber']).optional(),
	runs: z.enum(['0', '1']).optional(),
	q: z.string().max(80).optional(),
	sort: z.enum(['newest', 'fastest']).default('newest'),
	cursor: z.string().max(200).optional(),
	limit: z.coerce.number().int().min(1).max(100).default(24)
});

// Public list of published sheets; cursor pagination so "load more" never repeats or skips.
export const GET: RequestHandler = api(async ({ url }) => {
	const q = parse(query, Object.fromEntries(url.searchParams));
	const page = await builds.listCursor({
		cycle: q.cycle,
		exhaust: q.exhaust,
		withRuns: q.runs === '1',
		q: q.q,
		sort: q.sort,
		cursor: q.cursor,
		limit: q.limit
	});
	return json(page);
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
