import { fail, redirect } from '@sveltejs/kit';
import { Failure } from '$lib/failure';
import { requireUser } from '$lib/server/guard';
import { deleteCard, listCards, listRunPlaces, saveCard } from '$lib/server/riding/places';
import { forPages } from '$lib/server/web/page-failure';
import { FORMS } from '$lib/slide-rule/form-defs';
import { placeFields, type Card, type RunPlace } from '$lib/slide-rule/places';
import type { Actions, PageServerLoad } from './$types';

type Side = 'from' | 'to';
const prefixed = (side: Side, fields: Record<string, string>) =>
	Object.fromEntries(
		Object.entries(fields).map(([k, v]) => [side + k[0].toUpperCase() + k.slice(1), v])
	);

/** The place a "fill from" choice names (`card:3`, `run:12`), among the member's own. */
function chosen(places: { cards: Card[]; runs: RunPlace[] }, choice: string | null) {
	const [kind, id] = (choice ?? '').split(':');
	if (kind === 'card') return places.cards.find((c) => c.id === Number(id));
	if (kind === 'run') return places.runs.find((r) => r.id === Number(id));
	return undefined;
}

/** The sheet's own fields from a sent form, to reopen it as it was. */
const sheetOf = (data: FormData) => {
	const q = new URLSearchParams();
	for (const name of ['units', ...FORMS.retune.map((f) => f.name)]) {
		const v = data.get(name);
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
		const p = chosen(places, url.searchParams.get(`${side}Source`));
		const units = url.searchParams.get('units') === 'imperial' ? 'imperial' : 'metric';
		if (p) Object.assign(prefill, prefixed(side, placeFields(p, units)));
		if (p && side === 'from' && 'mainJet' in p && p.mainJet !== null) {
			prefill.jet = String(p.mainJet);
			prefill.numbering = p.jetNumbering;
		}
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
		const was = new URLSearchParams(String(data.get('sheet') ?? '').replace(/^\?/, ''));
		const q = new URLSearchParams();
		for (const name of ['units', ...FORMS.retune.map((f) => f.name)]) {
			const v = was.get(name);
			if (v !== null) q.set(name, v);
		}
		redirect(303, `/slide-rule/retune?${q}`);
	}
});
