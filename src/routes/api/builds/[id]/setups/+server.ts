import { json } from '@sveltejs/kit';
import { api, created, readJson } from '$lib/server/api';
import * as setups from '$lib/server/sheet/setups';
import { editBuild, idParam, readBuild } from '$lib/server/sheet/access';
import { sheetBody } from '$lib/server/sheet/api-bodies';
import { saveSetup } from '$lib/server/sheet/service';
import { SETUP_FIELDS } from '$lib/sheet/setup-fields';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = api(async (event) => {
	const { build } = await readBuild(event, idParam(event.params.id));
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
	const { build } = await editBuild(event, idParam(event.params.id));
	const stored = sheetBody('setup', SETUP_FIELDS, await readJson(event.request), 'draft');
	const r = (await saveSetup(build.id, stored)) as { id: number };
	return created({ id: r.id });
});
