import { reportSchema } from '$lib/schemas/review';
import { api, Failure, created, parse, readJson } from '$lib/server/api';
import { reportsByAccount, reportsByAddress, spend, waitText } from '$lib/server/auth/limits';
import { clock } from '$lib/clock';
import { requireUser } from '$lib/server/guard';
import { fileReport } from '$lib/server/review/reports';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = api(async (event) => {
	const me = requireUser(event);
	const body = parse(reportSchema, await readJson(event.request));
	const limit = await spend([
		[reportsByAccount, me.id],
		[reportsByAddress, event.getClientAddress()]
	]);
	if (!limit.ok)
		throw new Failure(429, `Too many reports; try again in ${waitText(limit.retryAfterS)}.`);
	const r = await fileReport(
		me,
		{ type: body.itemType, id: body.itemId },
		{ reason: body.reason, note: body.note },
		clock()
	);
	return created({ filed: r.filed, addedToEarlier: r.added });
});
