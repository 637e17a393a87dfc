import { error, fail, redirect } from '@sveltejs/kit';
import { ITEM_TYPES, type ItemType } from '$lib/review/kinds';
import { putBackSchema } from '$lib/schemas/review';
import { clock } from '$lib/clock';
import { requireRole } from '$lib/server/guard';
import { readCase } from '$lib/server/review/cases';
import { putBack } from '$lib/server/review/desk';
import { requireItem, type ItemRef } from '$lib/server/review/items';
import * as log from '$lib/server/review/log';
import { parseForm } from '$lib/server/web/plain-form';
import { forPages } from '$lib/server/web/page-failure';
import type { Actions, PageServerLoad } from './$types';

// One item's page on the desk: what it is, whether it is down and why, everything the desk did
// about it, and putting it back with a reason.

function refOf(params: { type: string; id: string }): ItemRef {
	const type = ITEM_TYPES.find((t) => t === params.type) as ItemType | undefined;
	if (!type) error(404, 'No such item.');
	return { type, id: Number(params.id) };
}

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'moderator');
	const ref = refOf(event.params);
	const [item, c, history] = await Promise.all([
		requireItem(ref),
		readCase(ref),
		log.list({ itemType: ref.type, itemId: ref.id, limit: 100 })
	]);
	return {
		item: {
			type: ref.type,
			id: ref.id,
			title: item.title,
			href: item.href,
			text: item.text,
			hidden: item.hidden,
			hiddenReason: item.hiddenReason
		},
		onDesk: Boolean(c?.onDesk),
		history
	};
};

export const actions: Actions = forPages({
	putBack: async (event) => {
		const me = requireRole(event, 'moderator');
		const ref = refOf(event.params);
		const form = await parseForm(event.request, putBackSchema);
		if (!form.ok) return fail(400, { values: form.values, message: form.message });
		await putBack(me, ref, form.data.reason, clock());
		redirect(303, `/review/items/${ref.type}/${ref.id}?done=restore`);
	}
});
