import { fail, redirect } from '@sveltejs/kit';
import { Failure } from '$lib/server/api';
import { createBuild } from '$lib/server/sheet/build-service';
import { importBuild } from '$lib/server/sheet/export';
import { requireUser } from '$lib/server/guard';
import { readSheetForm, sheetForm } from '$lib/server/sheet/forms';
import { unitsFor } from '$lib/server/sheet/units';
import { BUILD_FIELDS } from '$lib/sheet/fields';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireUser(event);
	const units = unitsFor(event);
	return {
		units,
		form: await sheetForm('build', BUILD_FIELDS, units, null)
	};
};

export const actions: Actions = {
	/** Upload of an exported sheet: always a new draft; problems are listed with their paths. */
	import: async (event) => {
		const me = requireUser(event);
		const file = (await event.request.formData()).get('sheet');
		if (!(file instanceof File) || file.size === 0)
			return fail(400, {
				importProblems: [{ path: '', message: 'Choose an exported sheet (a .json file).' }]
			});
		if (file.size > 5 * 1024 * 1024)
			return fail(413, {
				importProblems: [
					{ path: '', message: 'That file is over 5 MB; an exported sheet is far smaller.' }
				]
			});
		let doc: unknown;
		try {
			doc = JSON.parse(await file.text());
		} catch {
			return fail(400, {
				importProblems: [
					{
						path: '',
						message: 'That file is not JSON. Export a sheet from its page and upload that file.'
					}
				]
			});
		}
		let id: number;
		try {
			id = await importBuild(me.id, doc);
		} catch (e) {
			if (e instanceof Failure)
				return fail(422, {
					importProblems: e.issues.length ? e.issues : [{ path: '', message: e.message }]
				});
			throw e;
		}
		redirect(303, `/builds/${id}/edit`);
	},
	create: async (event) => {
		const me = requireUser(event);
		const { form, stored } = await readSheetForm(event.request, 'build', BUILD_FIELDS);
		if (!form.valid) return fail(400, { form });
		const b = await createBuild(me.id, stored);
		redirect(303, `/builds/${b.id}/setups/new`);
	}
};
