import { api, parse } from '$lib/server/api';
import { speedMapKept } from '$lib/server/stats/speed-map';
import { keptJson } from '$lib/server/web/kept-json';
import { paramsObject, speedMapQuerySchema } from '$lib/schemas/stats';
import type { RequestHandler } from './$types';

// Public, like the published sheets it aggregates.
export const GET: RequestHandler = api(async ({ url }) => {
	const q = parse(speedMapQuerySchema, paramsObject(url.searchParams));
	return keptJson(await speedMapKept(q));
});
