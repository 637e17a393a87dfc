import * as builds from '$lib/server/db/builds';
import { unitsFor } from '$lib/server/sheets/units';
import type { PageServerLoad } from './$types';

// Public: anyone may browse published sheets.
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
		page: Math.max(1, Number(q.get('page')) || 1)
	};
	const { rows, count, page, pages } = await builds.listPublished(filters);
	return {
		units: unitsFor(event),
		filters: { ...filters, q: filters.q ?? '' },
		count,
		page,
		pages,
		builds: rows.map((b) => ({
			id: b.id,
			title: b.title,
			owner: b.owner?.name ?? 'a member',
			engineFamily: b.engineFamily,
			bestSpeedKmh: b.bestSpeedKmh,
			stockSpeedKmh: b.stockSpeedKmh,
			partsTotalMinor: b.partsTotalMinor,
			currency: b.currency,
			setupCount: b.setupCount,
			runCount: b.runCount
		}))
	};
};
