import { searchClose } from '$lib/server/close/search';
import { closeQuerySchema } from '$lib/schemas/close';
import type { PageServerLoad } from './$types';

// Public. The first answer is rendered on the server (works without JavaScript); the page then
// asks GET /api/builds/close itself as the form changes.
export const load: PageServerLoad = async ({ url }) => {
	const raw = Object.fromEntries(url.searchParams);
	const q = closeQuerySchema.parse(raw);
	return { raw, answer: await searchClose(q) };
};
