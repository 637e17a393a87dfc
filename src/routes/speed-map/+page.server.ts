import { unitsFor } from '$lib/server/sheet/units';
import { engineFamilies } from '$lib/server/stats/families';
import { speedMapKept } from '$lib/server/stats/speed-map';
import { speedMapMarkup } from '$lib/server/stats/speed-map-svg';
import { slot } from '$lib/server/web/html-slots';
import { paramsObject, speedMapQuerySchema } from '$lib/schemas/stats';
import type { PageServerLoad } from './$types';

// Public. The first map is drawn here (so a shared link opens on it, with or without script) and
// put into the HTML once: the page's data carries the map without its marks, which the page asks
// GET /api/stats/speed-map for only when the reader opens the table or changes a filter.
export const load: PageServerLoad = async (event) => {
	const query = speedMapQuerySchema.parse(paramsObject(event.url.searchParams));
	const [map, families] = await Promise.all([speedMapKept(query), engineFamilies()]);
	const units = unitsFor(event);
	return {
		query,
		map: { ...map, points: [], bins: [], marksLeftOut: true as const },
		families,
		units,
		chart: slot(event, 'speed-map-chart', speedMapMarkup(map, units))
	};
};
