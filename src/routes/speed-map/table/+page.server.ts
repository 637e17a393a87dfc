import { unitsFor } from '$lib/server/sheet/units';
import { speedMapKept } from '$lib/server/stats/speed-map';
import { paramsObject, speedMapQuerySchema } from '$lib/schemas/stats';
import type { PageServerLoad } from './$types';

// Public: the speed map's data as a table on a page of its own, for long lists and for readers
// without scripts (the map's own page opens its table on demand).
export const load: PageServerLoad = async (event) => {
	const query = speedMapQuerySchema.parse(paramsObject(event.url.searchParams));
	return { map: await speedMapKept(query), units: unitsFor(event), search: event.url.search };
};
