import { fail, redirect } from '@sveltejs/kit';
import { transferRefSchema } from '$lib/schemas/shops';
import { clock } from '$lib/clock';
import * as builds from '$lib/server/sheet/builds';
import { requireUser } from '$lib/server/guard';
import { parseForm } from '$lib/server/web/plain-form';
import { unitsFor } from '$lib/server/sheet/units';
import { acceptHandover, handoversFor } from '$lib/server/shops/transfers';
import { forPages } from '$lib/server/web/page-failure';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const me = requireUser(event);
	const [rows, handovers] = await Promise.all([builds.listBench(me.id), handoversFor(me)]);
	return {
		units: unitsFor(event),
		handovers,
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
			runCount: b.runCount,
			lastSetupId: (b.get('lastSetupId') as number | null) ?? null
		}))
	};
};

export const actions: Actions = forPages({
	acceptHandover: async (event) => {
		const me = requireUser(event);
		const form = await parseForm(event.request, transferRefSchema);
		if (!form.ok) return fail(400, { handover: { message: form.message } });
		const r = await acceptHandover(me, { transferId: form.data.transferId }, clock());
		if (!r.ok) return fail(409, { handover: { message: 'That offer is no longer open.' } });
		redirect(303, `/builds/${r.handover.buildId}`);
	}
});
