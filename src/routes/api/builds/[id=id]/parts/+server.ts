import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/guard';
import { api, readJson } from '$lib/server/api';
import { createOnce } from '$lib/server/web/idempotency';
import * as parts from '$lib/server/sheet/parts';
import { editBuild, readBuild } from '$lib/server/sheet/access';
import { partBody } from '$lib/server/sheet/api-bodies';
import { addPart } from '$lib/server/sheet/service';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = api(async (event) => {
	const { build } = await readBuild(event, Number(event.params.id));
	const rows = await parts.listForBuild(build.id);
	return json({
		currency: build.currency,
		parts: rows.map((p) => ({
			id: p.id,
			category: p.category,
			name: p.name,
			costMinor: p.costMinor,
			link: p.link,
			setupId: p.setupId
		}))
	});
});

export const POST: RequestHandler = api(async (event) => {
	const { build } = await editBuild(event, Number(event.params.id));
	const body = await readJson(event.request);
	const stored = partBody(body);
	return createOnce(event.request, requireUser(event).id, body, async () => ({
		ok: true,
		...(await addPart(build.id, stored))
	}));
});
