import { parse } from '$lib/failure';
import { scooterPageSchema } from '$lib/schemas/scooters';
import { readScooter, scooterBuilds } from '$lib/server/scooters/catalogue';
import { viewerOf } from '$lib/server/scooters/viewer';
import { unitsFor } from '$lib/server/sheet/units';
import { forPage } from '$lib/server/web/page-failure';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = forPage(async (event) => {
	const q = parse(scooterPageSchema, Object.fromEntries(event.url.searchParams));
	const scooter = await readScooter(Number(event.params.id), viewerOf(event));
	const { builds, next } = await scooterBuilds(scooter.id, q.before ?? null);
	return { scooter, builds, next, units: unitsFor(event) };
});
