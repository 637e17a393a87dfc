import { fail, redirect } from '@sveltejs/kit';
import { message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import * as builds from '$lib/server/db/builds';
import * as parts from '$lib/server/db/parts';
import * as runs from '$lib/server/db/runs';
import * as setups from '$lib/server/db/setups';
import { editBuild, idParam } from '$lib/server/sheets/access';
import { CONFLICT, readSheetForm, sheetForm } from '$lib/server/sheets/forms';
import { addPart, publishProblems, removePart, setPublication } from '$lib/server/sheets/service';
import { unitsFor } from '$lib/server/sheets/units';
import { BUILD_FIELDS, PART_FIELDS } from '$lib/sheet/fields';
import { schemaFor } from '$lib/sheet/schema';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

const mine = (event: RequestEvent) => editBuild(event, idParam(event.params.id));

export const load: PageServerLoad = async (event) => {
	const { build } = await mine(event);
	const units = unitsFor(event);
	const [setupRows, runRows, partRows, form, partForm] = await Promise.all([
		setups.listForBuild(build.id),
		runs.listForBuild(build.id),
		parts.listForBuild(build.id),
		sheetForm('build', BUILD_FIELDS, units, build.get({ plain: true })),
		superValidate(zod4(schemaFor('part', PART_FIELDS, units, 'complete')))
	]);
	return {
		units,
		form,
		partForm,
		build: {
			id: build.id,
			title: build.title,
			version: build.version,
			publication: build.publication,
			currency: build.currency,
			partsTotalMinor: build.partsTotalMinor
		},
		setups: setupRows.map((s) => ({
			id: s.id,
			position: s.position,
			changeNote: s.changeNote,
			isStock: s.isStock
		})),
		runs: runRows.map((r) => ({
			id: r.id,
			setupId: r.setupId,
			runOn: r.runOn,
			speedKmh: r.speedKmh,
			method: r.method
		})),
		parts: partRows.map((p) => ({
			id: p.id,
			name: p.name,
			category: p.category,
			costMinor: p.costMinor,
			setupId: p.setupId
		})),
		problems: build.publication === 'draft' ? await publishProblems(build) : []
	};
};

export const actions: Actions = {
	save: async (event) => {
		const { build } = await mine(event);
		const { form, stored, version } = await readSheetForm(event.request, 'build', BUILD_FIELDS);
		if (!form.valid) return fail(400, { form });
		if (!(await builds.update(build.id, version, stored as builds.BuildPatch)))
			return message(form, CONFLICT, { status: 409 });
		return message(form, 'Saved.');
	},
	addPart: async (event) => {
		const { build } = await mine(event);
		const { form, stored } = await readSheetForm(event.request, 'part', PART_FIELDS, 'complete');
		if (!form.valid) return fail(400, { partForm: form });
		await addPart(build.id, stored);
		redirect(303, `/builds/${build.id}/edit#parts`);
	},
	removePart: async (event) => {
		const { build } = await mine(event);
		const id = Number((await event.request.formData()).get('partId'));
		await removePart(build.id, id);
		redirect(303, `/builds/${build.id}/edit#parts`);
	},
	publish: async (event) => {
		const { build } = await mine(event);
		const problems = await publishProblems(build);
		if (problems.length) return fail(400, { publishProblems: problems });
		await setPublication(build, 'published');
		redirect(303, `/builds/${build.id}`);
	},
	unpublish: async (event) => {
		const { build } = await mine(event);
		await setPublication(build, 'draft');
		redirect(303, `/builds/${build.id}/edit`);
	},
	destroy: async (event) => {
		const { build } = await mine(event);
		await builds.destroy(build.id);
		redirect(303, '/bench');
	}
};
