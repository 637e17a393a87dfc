import { unitsFor } from '$lib/server/sheet/units';
import { pairsFor, summarise } from '$lib/server/stats/change-effects';
import type { ChangeKind } from '$lib/sheet/change-kinds';
import { changeEffectsQuerySchema, paramsObject } from '$lib/schemas/stats';
import type { PageServerLoad } from './$types';

// Public. Same data as GET /api/stats/change-effects; choosing a kind is a plain link (?kind=).
export const load: PageServerLoad = async (event) => {
	const q = changeEffectsQuerySchema.parse(paramsObject(event.url.searchParams));
	const [kinds, pairs] = await Promise.all([
		summarise(),
		q.kind ? pairsFor(q.kind as ChangeKind) : Promise.resolve(null)
	]);
	return { kinds, kind: q.kind ?? null, pairs, units: unitsFor(event) };
};
