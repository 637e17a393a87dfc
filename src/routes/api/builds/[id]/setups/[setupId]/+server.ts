import { json } from '@sveltejs/kit';
import { api, ApiFailure, noContent, readJson } from '$lib/server/api';
import * as setups from '$lib/server/sheet/setups';
import { editSetup } from '$lib/server/sheet/access';
import { sheetBody, versionOf } from '$lib/server/sheet/api-bodies';
import { recomputeBuild } from '$lib/server/derived/recompute';
import { saveSetup } from '$lib/server/sheet/service';
import { SETUP_FIELDS } from '$lib/sheet/setup-fields';
import type { RequestHandler } from './$types';

export const PATCH: RequestHandler = api(async (event) => {
	const { build, setup } = await editSetup(event);
	const body = await readJson(event.request);
	const version = versionOf(body);
	const stored = sheetBody(
		'setup',
		SETUP_FIELDS,
		{ ...setup.config, changeNote: setup.changeNote, isStock: setup.isStock, ...(body as object) },
		'draft'
	);
	const r = await saveSetup(build.id, stored, { id: setup.id, version });
	if ('conflict' in r)
		throw new ApiFailure(409, 'The setup changed since that version; fetch it again.');
	return json({ id: setup.id, version: version + 1 });
});

export const DELETE: RequestHandler = api(async (event) => {
	const { build, setup } = await editSetup(event);
	await setups.destroy(setup.id);
	await recomputeBuild(build.id);
	return noContent();
});
