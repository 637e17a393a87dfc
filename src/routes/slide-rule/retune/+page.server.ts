import { fail, redirect } from '@sveltejs/kit';
import { Failure } from '$lib/failure';
import { requireUser } from '$lib/server/guard';
import { deleteCard, listCards, listRunPlaces, saveCard } from '$lib/server/riding/places';
import { forPages } from '$lib/server/web/page-failure';
import { FORMS } from '$lib/slide-rule/form-defs';
import { chosenPlace, placePatch } from '$lib/slide-rule/places';
import type { Actions, PageServerLoad } from './$types';

type Side = 'from' | 'to';

/** The sheet's own fields (from a sent form or a kept address), to reopen it as it was. */
const sheetOf = (from: { get(name: string): unknown }) => {
	const q = new URLSearchParams();
	for (const name of ['units', ...FORMS.retune.map((f) => f.name)]) {
		const v = from.get(name);
		if (typeof v === 'string') q.set(name, v);
	}
	return q;
};

export const load: PageServerLoad = async ({ locals, url }) => {
	const me = locals.user;
	const places = me
		? { cards: await listCards(me), runs: await listRunPlaces(me) }
		: { cards: [], runs: [] };
	// Without JavaScript a place is filled by sending the form with its "use" button.
	const prefill: Record<string, string> = {};
	const side = url.searchParams.get('fill');
	if (side === 'from' || side === 'to') {
		const p = chosenPlace(places, url.searchParams.get(`${side}Source`));
		const units = url.searchParams.get('units') === 'imperial' ? 'imperial' : 'metric';
		if (p) Object.assign(prefill, placePatch(side, p, units));
	}
	return { places, prefill, signedIn: !!me };
};

export const actions: Actions = forPages({
	saveCard: async (event) => {
		const me = requireUser(event);
		const data = await event.request.formData();
		const side: Side = data.get('side') === 'from' ? 'from' : 'to';
		const field = (k: string) => String(data.get(side + k) ?? '');
		const name = String(data.get(`cardName-${side}`) ?? '');
		try {
			await saveCard(me, {
				name,
				units: data.get('units') === 'imperial' ? 'imperial' : 'metric',
				elevation: field('Elevation'),
				temp: field('Temp'),
				humidity: field('Humidity'),
				pressure: field('Pressure'),
				pressureKind: field('PressureKind') || 'sea-level'
			});
		} catch (e) {
			if (!(e instanceof Failure)) throw e;
			const why =
				e.issues[0]?.path === 'name' || !e.issues.length
					? e.message
					: `${e.message} (${e.issues.map((i) => i.message).join(' ')})`;
			return fail(400, {
				card: { side, name, message: why },
				values: Object.fromEntries(sheetOf(data))
			});
		}
		const q = sheetOf(data);
		q.set('saved', name.trim());
		redirect(303, `/slide-rule/retune?${q}`);
	},
	deleteCard: async (event) => {
		const me = requireUser(event);
		const data = await event.request.formData();
		await deleteCard(me, Number(data.get('cardId')));
		// Back to the sheet as it was: only its own fields, re-encoded, on this page.
		const q = sheetOf(new URLSearchParams(String(data.get('sheet') ?? '').replace(/^\?/, '')));
		redirect(303, `/slide-rule/retune?${q}`);
	}
});
