import { reportSchema } from '$lib/schemas/review';
import { api, created, parse, readJson } from '$lib/server/api';
import { clock } from '$lib/clock';
import { requireUser } from '$lib/server/guard';
import { fileReport } from '$lib/server/review/reports';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = api(async (event) => {
	const me = requireUser(event);
	const body = parse(reportSchema, await readJson(event.request));
	const r = await fileReport(
		me,
		{ type: body.itemType, id: body.itemId },
		{ reason: body.reason, note: body.note },
		clock(),
		event.getClientAddress()
	);
	return created({ filed: r.filed, addedToEarlier: r.added });
});
