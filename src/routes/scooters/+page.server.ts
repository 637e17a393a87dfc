import { parse } from '$lib/failure';
import { scooterQuerySchema } from '$lib/schemas/scooters';
import { findScooters } from '$lib/server/scooters/catalogue';
import { viewerOf } from '$lib/server/scooters/viewer';
import { unitsFor } from '$lib/server/sheet/units';
import { forPage } from '$lib/server/web/page-failure';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = forPage(async (event) => {
	const q = parse(scooterQuerySchema, Object.fromEntries(event.url.searchParams));
	return {
		q: q.q ?? '',
		scooters: await findScooters(q.q ?? '', viewerOf(event)),
		units: unitsFor(event)
	};
});
