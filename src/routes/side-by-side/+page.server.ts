import { unitsFor } from '$lib/server/sheet/units';
import { loadColumns } from '$lib/server/stats/side-by-side';
import { sideBySide } from '$lib/sheet/side-by-side';
import { parseIds, SIDE_BY_SIDE_MAX } from '$lib/stats/pick';
import { sideBySideQuerySchema } from '$lib/schemas/side-by-side';
import type { PageServerLoad } from './$types';

// Public; each build's own visibility rule still applies (drafts only for their owner).
export const load: PageServerLoad = async (event) => {
	// Repeated keys (?builds=3&builds=9, as a form of tick boxes sends them) or a comma list.
	const p = event.url.searchParams;
	const raw = { builds: p.getAll('builds').join(','), setups: p.getAll('setups').join(',') };
	const q = sideBySideQuerySchema.parse(raw);
	// More than fit: the first four are shown and the page says how many were left out.
	const asked = Math.max(parseIds(raw.builds).length, parseIds(raw.setups).length);
	const leftOut = Math.max(0, asked - SIDE_BY_SIDE_MAX);
	const units = unitsFor(event);
	const by = q.setups.length ? 'setups' : 'builds';
	const pick = by === 'setups' ? { setups: q.setups } : { builds: q.builds };
	const { columns, missing } = await loadColumns(pick, event.locals.user ?? null);
	return {
		by,
		units,
		missing,
		leftOut,
		columns: columns.map(({ buildId, setupId, title, owner, position }) => ({
			buildId,
			setupId,
			title,
			owner,
			position
		})),
		sections: sideBySide(columns, units)
	};
};
