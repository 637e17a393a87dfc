import { json } from '@sveltejs/kit';
import { api, parse } from '$lib/server/api';
import { speedMapKept } from '$lib/server/stats/speed-map';
import { paramsObject, speedMapQuerySchema } from '$lib/schemas/stats';
import type { RequestHandler } from './$types';

// Public, like the published sheets it aggregates.
export const GET: RequestHandler = api(async ({ url }) => {
	const q = parse(speedMapQuerySchema, paramsObject(url.searchParams));
	return json(await speedMapKept(q));
});
