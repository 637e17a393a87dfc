import { json } from '@sveltejs/kit';
import { api, parse } from '$lib/server/api';
import { scooterPageSchema } from '$lib/schemas/scooters';
import { readScooter, scooterBuilds } from '$lib/server/scooters/catalogue';
import { viewerOf } from '$lib/server/scooters/viewer';
import { stockGearingLimitKmh } from '$lib/scooters/catalogue';
import type { RequestHandler } from './$types';

// One base scooter: its stock data, what its stock gearing allows, and its published builds.
export const GET: RequestHandler = api(async (event) => {
	const q = parse(scooterPageSchema, Object.fromEntries(event.url.searchParams));
	const scooter = await readScooter(Number(event.params.id), viewerOf(event));
	const { builds, next } = await scooterBuilds(scooter.id, q.before ?? null);
	return json({ scooter, stockGearingLimitKmh: stockGearingLimitKmh(scooter), builds, next });
});
