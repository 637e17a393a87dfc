import { json } from '@sveltejs/kit';
import { api, parse } from '$lib/server/api';
import { scooterQuerySchema } from '$lib/schemas/scooters';
import { findScooters } from '$lib/server/scooters/catalogue';
import { viewerOf } from '$lib/server/scooters/viewer';
import type { RequestHandler } from './$types';

// The catalogue of base scooters, searched by a typed name (typos forgiven); public.
export const GET: RequestHandler = api(async (event) => {
	const q = parse(scooterQuerySchema, Object.fromEntries(event.url.searchParams));
	return json({ scooters: await findScooters(q.q ?? '', viewerOf(event)) });
});
