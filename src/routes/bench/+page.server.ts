import * as builds from '$lib/server/db/builds';
import { requireUser } from '$lib/server/guard';
import { unitsFor } from '$lib/server/sheets/units';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const me = requireUser(event);
	const rows = await builds.listBench(me.id);
	return {
		units: unitsFor(event),
		builds: rows.map((b) => ({
			id: b.id,
			title: b.title,
			engineFamily: b.engineFamily,
			publication: b.publication,
			bestSpeedKmh: b.bestSpeedKmh,
			stockSpeedKmh: b.stockSpeedKmh,
			partsTotalMinor: b.partsTotalMinor,
			currency: b.currency,
			setupCount: b.setupCount,
			runCount: b.runCount
		}))
	};
};
