import { unitsFor } from '$lib/server/sheet/units';
import { changeEffectsKept } from '$lib/server/stats/change-effects';
import type { ChangeKind } from '$lib/sheet/change-kinds';
import { changeEffectsQuerySchema, paramsObject } from '$lib/schemas/stats';
import type { PageServerLoad } from './$types';

// Public. Same data as GET /api/stats/change-effects; choosing a kind is a plain link (?kind=).
export const load: PageServerLoad = async (event) => {
	const q = changeEffectsQuerySchema.parse(paramsObject(event.url.searchParams));
	const { kinds, pairs } = await changeEffectsKept((q.kind as ChangeKind | undefined) ?? null);
	return { kinds, kind: q.kind ?? null, pairs, units: unitsFor(event) };
};
