import { api } from '$lib/server/api';
import { requireUser } from '$lib/server/guard';
import { deleteCard } from '$lib/server/riding/places';
import type { RequestHandler } from './$types';

export const DELETE: RequestHandler = api(async (event) => {
	const me = requireUser(event);
	await deleteCard(me, Number(event.params.cardId));
	return new Response(null, { status: 204 });
});
