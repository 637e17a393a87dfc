import { json } from '@sveltejs/kit';
import * as deskNotes from '$lib/server/review/notes';
import { apiError, requireRole } from '$lib/server/guard';
import { deskNoteSchema } from '$lib/schemas/review-notes';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async (event) => {
	requireRole(event, 'moderator');
	return json({ notes: await deskNotes.list() });
};

export const POST: RequestHandler = async (event) => {
	const me = requireRole(event, 'moderator');
	const body = await event.request.json().catch(() => undefined);
	if (body === undefined) return apiError(400, 'The body is not valid JSON.');
	const parsed = deskNoteSchema.safeParse(body);
	if (!parsed.success) {
		return apiError(
			422,
			'The note is not valid.',
			parsed.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }))
		);
	}
	const id = await deskNotes.create(me.id, parsed.data.body);
	return json({ id }, { status: 201 });
};
