import { json } from '@sveltejs/kit';
import { api, parse } from '$lib/server/api';
import { changeEffectsKept } from '$lib/server/stats/change-effects';
import { PAIR_RULES, type ChangeKind } from '$lib/sheet/change-kinds';
import { changeEffectsQuerySchema, paramsObject } from '$lib/schemas/stats';
import type { RequestHandler } from './$types';

// Public. ?kind= adds that kind's pairs (the first 50, largest gain first).
export const GET: RequestHandler = api(async ({ url }) => {
	const q = parse(changeEffectsQuerySchema, paramsObject(url.searchParams));
	const { kinds, pairs } = await changeEffectsKept((q.kind as ChangeKind | undefined) ?? null);
	return json({ rules: PAIR_RULES, kinds, kind: q.kind ?? null, pairs });
});
