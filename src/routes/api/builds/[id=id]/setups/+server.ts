import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/guard';
import { api, readJson } from '$lib/server/api';
import { createOnce } from '$lib/server/web/idempotency';
import * as setups from '$lib/server/sheet/setups';
import { editBuild, readBuild } from '$lib/server/sheet/access';
import { sheetBody } from '$lib/server/sheet/api-bodies';
import { saveSetup } from '$lib/server/sheet/service';
import { SETUP_FIELDS } from '$lib/sheet/setup-fields';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = api(async (event) => {
	const { build } = await readBuild(event, Number(event.params.id));
	const rows = await setups.listForBuild(build.id);
	return json({
		setups: rows.map((s) => ({
			id: s.id,
			position: s.position,
			changeNote: s.changeNote,
			isStock: s.isStock,
			version: s.version,
			config: s.config,
			displacementCc: s.displacementCc,
			gearingLimitKmh: s.gearingLimitKmh,
			bestRunKmh: s.bestRunKmh
		}))
	});
});

export const POST: RequestHandler = api(async (event) => {
	const { build } = await editBuild(event, Number(event.params.id));
	const body = await readJson(event.request);
	const stored = sheetBody('setup', SETUP_FIELDS, body, 'draft');
	return createOnce(event.request, requireUser(event).id, body, () => saveSetup(build.id, stored));
});
