import { json } from '@sveltejs/kit';
import { api, created, readJson } from '$lib/server/api';
import { requireUser } from '$lib/server/guard';
import { listCards, listRunPlaces, saveCard } from '$lib/server/riding/places';
import type { RequestHandler } from './$types';

/** The member's riding-conditions cards and latest logged runs: the places a retune can start from. */
export const GET: RequestHandler = api(async (event) => {
	const me = requireUser(event);
	return json({ cards: await listCards(me), runs: await listRunPlaces(me) });
});

/** Saves a card under its name (a name the member already has is replaced). */
export const POST: RequestHandler = api(async (event) => {
	const me = requireUser(event);
	return created(await saveCard(me, await readJson(event.request)));
});
