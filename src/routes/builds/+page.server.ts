import * as builds from '$lib/server/db/builds';
import { unitsFor } from '$lib/server/sheets/units';
import type { PageServerLoad } from './$types';

// Public: anyone may browse published sheets. The same cursor pages as GET /api/builds.
export const load: PageServerLoad = async (event) => {
	const q = event.url.searchParams;
	const filters = {
		cycle: ['two-stroke', 'four-stroke'].includes(q.get('cycle') ?? '')
			? q.get('cycle')!
			: undefined,
		exhaust: ['stock', 'sport', 'expansion-chamber'].includes(q.get('exhaust') ?? '')
			? q.get('exhaust')!
			: undefined,
		withRuns: q.get('runs') === '1',
		q: q.get('q')?.trim().slice(0, 80) || undefined,
		sort: q.get('sort') === 'fastest' ? ('fastest' as const) : ('newest' as const)
	};
	const page = await builds.listCursor({
		...filters,
		cursor: q.get('cursor') ?? undefined,
		limit: 24
	});
	return { units: unitsFor(event), filters: { ...filters, q: filters.q ?? '' }, ...page };
};
