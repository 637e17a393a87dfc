import { json } from '@sveltejs/kit';
import { commentSchema } from '$lib/schemas/review';
import { api, ApiFailure, created, parse, readJson } from '$lib/server/api';
import { clock } from '$lib/clock';
import { createComment, listComments, RateLimited } from '$lib/server/comments/comments';
import { requireUser } from '$lib/server/guard';
import { idParam, readBuild } from '$lib/server/sheet/access';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = api(async (event) => {
	const { build } = await readBuild(event, idParam(event.params.id));
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
	const { build } = await readBuild(event, idParam(event.params.id));
	const body = parse(commentSchema, await readJson(event.request));
	try {
		const c = await createComment(me, build, body, event.getClientAddress(), clock());
		return created({ id: c.id });
	} catch (e) {
		if (e instanceof RateLimited) throw new ApiFailure(429, e.message);
		throw e;
	}
});
