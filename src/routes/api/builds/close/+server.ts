import { json } from '@sveltejs/kit';
import { api, parse } from '$lib/server/api';
import { searchClose } from '$lib/server/close/search';
import { closeQuerySchema } from '$lib/schemas/close';
import type { RequestHandler } from './$types';

// Public: newcomers use it before they have an account.
export const GET: RequestHandler = api(async ({ url }) => {
	const q = parse(closeQuerySchema, Object.fromEntries(url.searchParams));
	return json(await searchClose(q));
});
