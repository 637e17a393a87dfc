import { json } from '@sveltejs/kit';
import { commentEditSchema } from '$lib/schemas/review';
import { api, parse, readJson } from '$lib/server/api';
import { clock } from '$lib/clock';
import { deleteComment, editComment, ownComment } from '$lib/server/comments/comments';
import { requireUser } from '$lib/server/guard';
import type { RequestHandler } from './$types';

export const PATCH: RequestHandler = api(async (event) => {
	const me = requireUser(event);
	const id = Number(event.params.commentId);
	// Whose it is comes before what was sent, so a stranger learns nothing from the body's errors.
	await ownComment(me, id);
	const { body } = parse(
		commentEditSchema.omit({ commentId: true }),
		await readJson(event.request)
	);
	await editComment(me, id, body, clock());
	return json({ ok: true });
});

export const DELETE: RequestHandler = api(async (event) => {
	const me = requireUser(event);
	await deleteComment(me, Number(event.params.commentId), clock());
	return new Response(null, { status: 204 });
});
