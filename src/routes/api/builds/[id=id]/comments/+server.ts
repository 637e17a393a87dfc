import { json } from '@sveltejs/kit';
import { commentSchema } from '$lib/schemas/review';
import { api, parse, readJson } from '$lib/server/api';
import { createOnce } from '$lib/server/web/idempotency';
import { clock } from '$lib/clock';
import { createComment, listComments } from '$lib/server/comments/comments';
import { requireUser } from '$lib/server/guard';
import { readBuild } from '$lib/server/sheet/access';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = api(async (event) => {
	const { build } = await readBuild(event, Number(event.params.id));
	const comments = await listComments(build, event.locals.user);
	return json({
		comments: comments.map((c) => ({
			id: c.id,
			parentId: c.parentId,
			setupId: c.setupId,
			author: c.author,
			createdAt: c.createdAt,
			editedAt: c.editedAt,
			state: c.state,
			html: c.html,
			hiddenReason: c.state === 'hidden' ? c.hiddenReason : null,
			underReview: c.caution
		}))
	});
});

export const POST: RequestHandler = api(async (event) => {
	const me = requireUser(event);
	const { build } = await readBuild(event, Number(event.params.id));
	const body = parse(commentSchema, await readJson(event.request));
	return createOnce(event.request, me.id, body, async () => ({
		id: (await createComment(me, build, body, event.getClientAddress(), clock())).id
	}));
});
