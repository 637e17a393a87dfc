import { json } from '@sveltejs/kit';
import { api, noContent, readJson } from '$lib/server/api';
import { editSetup } from '$lib/server/sheet/access';
import { sheetBody, versionOf } from '$lib/server/sheet/api-bodies';
import { removeSetup, saveSetup } from '$lib/server/sheet/service';
import { SETUP_FIELDS } from '$lib/sheet/setup-fields';
import type { RequestHandler } from './$types';

export const PATCH: RequestHandler = api(async (event) => {
	const { build, setup } = await editSetup(event);
	const body = await readJson(event.request);
	const version = versionOf(body);
	// What is stored, under what was sent; a stored null is an empty field, not a value to check.
	const merged = Object.fromEntries(
		Object.entries({
			...setup.config,
			changeNote: setup.changeNote,
			isStock: setup.isStock,
			...(body as object)
		}).filter(([, v]) => v !== null)
	);
	const stored = sheetBody('setup', SETUP_FIELDS, merged, 'draft');
	await saveSetup(build.id, stored, { id: setup.id, version });
	return json({ id: setup.id, version: version + 1 });
});

export const DELETE: RequestHandler = api(async (event) => {
	const { build, setup } = await editSetup(event);
	await removeSetup(build.id, setup.id);
	return noContent();
});
