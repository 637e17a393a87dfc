import { fail, redirect } from '@sveltejs/kit';
import { Failure } from '$lib/server/api';
import { createBuild } from '$lib/server/sheet/build-service';
import { importBuild } from '$lib/server/sheet/export';
import { requireUser } from '$lib/server/guard';
import { readSheetForm, sheetForm } from '$lib/server/sheet/forms';
import { unitsFor } from '$lib/server/sheet/units';
import { BUILD_FIELDS } from '$lib/sheet/fields';
import { startFromSchema } from '$lib/schemas/scooters';
import { formFailure } from '$lib/server/web/form-failure';
import { buildFieldsFrom } from '$lib/scooters/prefill';
import { findScooters, unlessRefused, usableScooter } from '$lib/server/scooters/catalogue';
import type { Actions, PageServerLoad } from './$types';

// A new sheet starts from a scooter of the catalogue (`?scooter=`, found by `?find=`, typos
// forgiven): the build's fields come filled in from it, and so will the stock baseline setup.
export const load: PageServerLoad = async (event) => {
	const me = requireUser(event);
	const units = unitsFor(event);
	const viewer = { id: me.id, role: me.role };
	const picked = Number(event.url.searchParams.get('scooter'));
	const find = (event.url.searchParams.get('find') ?? '').trim().slice(0, 80);
	const scooter =
		Number.isInteger(picked) && picked > 0
			? await unlessRefused(usableScooter(picked, me.id))
			: null;
	return {
		units,
		find,
		scooter,
		unknownScooter: picked > 0 && !scooter,
		found: !scooter && find ? (await findScooters(find, viewer)).slice(0, 8) : [],
		form: await sheetForm('build', BUILD_FIELDS, units, scooter ? buildFieldsFrom(scooter) : null)
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
		const { form, stored, fd } = await readSheetForm(event.request, 'build', BUILD_FIELDS);
		if (!form.valid) return fail(400, { form });
		const start = startFromSchema.safeParse({ baseScooterId: fd.get('baseScooterId') ?? '' });
		let b;
		try {
			if (!start.success) throw new Failure(422, 'Pick a scooter from the catalogue.');
			b = await createBuild(me.id, stored, start.data.baseScooterId);
		} catch (e) {
			return formFailure(form, e);
		}
		redirect(303, `/builds/${b.id}/setups/new`);
	}
};
