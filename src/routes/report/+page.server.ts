import { error, fail } from '@sveltejs/kit';
import { message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { ITEM_LABEL, ITEM_TYPES, type ItemType } from '$lib/review/kinds';
import { reportSchema } from '$lib/schemas/review';
import { clock } from '$lib/clock';
import { requireUser } from '$lib/server/guard';
import { requireItem } from '$lib/server/review/items';
import { fileReport } from '$lib/server/review/reports';
import { formFailure } from '$lib/server/web/form-failure';
import { forPages } from '$lib/server/web/page-failure';
import type { Actions, PageServerLoad } from './$types';

/** Only same-site paths, so the form's "back" link can never lead off Squishline. */
const safeBack = (v: string | null) => (v && /^\/(?!\/)/.test(v) ? v : '/');

export const load: PageServerLoad = async (event) => {
	const me = requireUser(event);
	const type = event.url.searchParams.get('type') as ItemType;
	const id = Number(event.url.searchParams.get('id'));
	if (!ITEM_TYPES.includes(type) || !Number.isInteger(id) || id <= 0) error(404, 'No such item.');
	const item = await requireItem({ type, id });
	if (!item.open && item.authorId !== me.id) error(404, 'No such item.');
	const form = await superValidate({ itemType: type, itemId: id }, zod4(reportSchema), {
		errors: false
	});
	return {
		form,
		item: { label: ITEM_LABEL[type], title: item.title, href: item.href },
		back: safeBack(event.url.searchParams.get('back'))
	};
};

export const actions: Actions = forPages({
	default: async (event) => {
		const me = requireUser(event);
		const form = await superValidate(event.request, zod4(reportSchema));
		if (!form.valid) return fail(400, { form });
		let r;
		try {
			r = await fileReport(
				me,
				{ type: form.data.itemType, id: form.data.itemId },
				{ reason: form.data.reason, note: form.data.note },
				clock(),
				event.getClientAddress()
			);
		} catch (e) {
			return formFailure(form, e);
		}
		return message(
			form,
			r.added
				? 'Thank you. We added this to your earlier report, which the desk has not decided yet.'
				: 'Thank you. The review desk will look at it; one report never takes anything down by itself.'
		);
	}
});
