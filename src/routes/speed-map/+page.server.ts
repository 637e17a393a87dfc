import { unitsFor } from '$lib/server/sheet/units';
import { engineFamilies } from '$lib/server/stats/families';
import { speedMapKept } from '$lib/server/stats/speed-map';
import { speedMapMarkup } from '$lib/server/stats/speed-map-svg';
import { paramsObject, speedMapQuerySchema } from '$lib/schemas/stats';
import type { PageServerLoad } from './$types';

// Public. The first map is rendered here (so a shared link opens on it); the page then asks
// GET /api/stats/speed-map itself whenever a filter changes.
export const load: PageServerLoad = async (event) => {
	const query = speedMapQuerySchema.parse(paramsObject(event.url.searchParams));
	const [map, families] = await Promise.all([speedMapKept(query), engineFamilies()]);
	const units = unitsFor(event);
	return {
		query,
		map,
		families,
		units,
		chart: speedMapMarkup(map, units)
	};
};
