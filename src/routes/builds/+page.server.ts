import { listBuilds } from '$lib/server/search/build-list';
import { currencyFor, unitsFor } from '$lib/server/sheet/units';
import { engineFamilies } from '$lib/server/stats/families';
import { buildListSchema } from '$lib/schemas/build-list';
import type { PageServerLoad } from './$types';

// Public: anyone may browse published sheets. The same pages as GET /api/builds.
export const load: PageServerLoad = async (event) => {
	const query = buildListSchema.parse(Object.fromEntries(event.url.searchParams));
	if (query.sort === 'cheapest') query.currency ??= currencyFor(event);
	const units = unitsFor(event);
	const [page, families] = await Promise.all([listBuilds(query, units), engineFamilies()]);
	return { units, query, families, ...page };
};
