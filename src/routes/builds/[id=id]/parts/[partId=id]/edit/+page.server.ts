import { fail, redirect } from '@sveltejs/kit';
import * as setups from '$lib/server/sheet/setups';
import { editPart } from '$lib/server/sheet/access';
import { readSheetForm, sheetForm } from '$lib/server/sheet/forms';
import { partToStored, removePart, updatePart } from '$lib/server/sheet/service';
import { unitsFor } from '$lib/server/sheet/units';
import { formFailure } from '$lib/server/web/form-failure';
import { PART_FIELDS } from '$lib/sheet/fields';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { build, part } = await editPart(event);
	const units = unitsFor(event);
	const form = await sheetForm('part', PART_FIELDS, units, partToStored(part), 'complete');
	const list = await setups.listForBuild(build.id);
	return {
		units,
		form,
		build: { id: build.id, title: build.title, currency: build.currency },
		part: { id: part.id, name: part.name },
		setups: list.map((s) => ({ value: String(s.id), label: `${s.position}. ${s.changeNote}` }))
	};
};

export const actions: Actions = {
	save: async (event) => {
		const { build, part } = await editPart(event);
		const { form, stored } = await readSheetForm(event.request, 'part', PART_FIELDS, 'complete');
		if (!form.valid) return fail(400, { form });
		try {
			await updatePart(build.id, part.id, stored);
		} catch (e) {
			return formFailure(form, e);
		}
		redirect(303, `/builds/${build.id}/edit#parts`);
	},
	remove: async (event) => {
		const { build, part } = await editPart(event);
		await removePart(build.id, part.id);
		redirect(303, `/builds/${build.id}/edit#parts`);
	}
};
