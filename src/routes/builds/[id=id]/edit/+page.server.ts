import { fail, redirect } from '@sveltejs/kit';
import { message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { Failure } from '$lib/failure';
import * as parts from '$lib/server/sheet/parts';
import * as runs from '$lib/server/sheet/runs';
import * as setups from '$lib/server/sheet/setups';
import { editBuild } from '$lib/server/sheet/access';
import {
	destroyBuild,
	publish,
	publishProblems,
	saveBuild,
	setPublication
} from '$lib/server/sheet/build-service';
import { readSheetForm, sheetForm } from '$lib/server/sheet/forms';
import {
	addPhoto,
	listPhotos,
	removePhoto,
	reorderPhotos,
	updatePhoto
} from '$lib/server/sheet/photos';
import { addPart, removePart } from '$lib/server/sheet/service';
import { unitsFor } from '$lib/server/sheet/units';
import { formFailure, plainFailure } from '$lib/server/web/form-failure';
import { BUILD_FIELDS, PART_FIELDS } from '$lib/sheet/fields';
import { schemaFor } from '$lib/sheet/schema';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

const mine = (event: RequestEvent) => editBuild(event, Number(event.params.id));

export const load: PageServerLoad = async (event) => {
	const { build } = await mine(event);
	const units = unitsFor(event);
	const [setupRows, runRows, partRows, photoRows, form, partForm] = await Promise.all([
		setups.listForBuild(build.id),
		runs.listForBuild(build.id),
		parts.listForBuild(build.id),
		listPhotos(build.id),
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
		photos: photoRows.map((p) => ({
			id: p.id,
			caption: p.caption,
			setupId: p.setupId,
			thumb: `/api/photos/${p.id}/thumb`
		})),
		problems: build.publication === 'draft' ? await publishProblems(build) : []
	};
};

export const actions: Actions = {
	save: async (event) => {
		const { build } = await mine(event);
		const { form, stored, version } = await readSheetForm(event.request, 'build', BUILD_FIELDS);
		if (!form.valid) return fail(400, { form });
		try {
			await saveBuild(build.id, version, stored);
		} catch (e) {
			return formFailure(form, e);
		}
		return message(form, 'Saved.');
	},
	addPart: async (event) => {
		const { build } = await mine(event);
		const { form, stored } = await readSheetForm(event.request, 'part', PART_FIELDS, 'complete');
		if (!form.valid) return fail(400, { partForm: form });
		try {
			await addPart(build.id, stored);
		} catch (e) {
			return formFailure(form, e);
		}
		redirect(303, `/builds/${build.id}/edit#parts`);
	},
	removePart: async (event) => {
		const { build } = await mine(event);
		const id = Number((await event.request.formData()).get('partId'));
		await removePart(build.id, id);
		redirect(303, `/builds/${build.id}/edit#parts`);
	},
	// The no-JavaScript way in; with JavaScript the page uploads to the API with a progress bar.
	addPhoto: async (event) => {
		const { build } = await mine(event);
		const fd = await event.request.formData();
		const file = fd.get('file');
		if (!(file instanceof File) || file.size === 0)
			return fail(400, { photoProblem: 'Choose a photo to upload.' });
		try {
			await addPhoto(build.id, new Uint8Array(await file.arrayBuffer()), {
				caption: String(fd.get('caption') ?? ''),
				setupId: Number(fd.get('setupId')) || null
			});
		} catch (e) {
			return plainFailure(e, 'photoProblem', { caption: String(fd.get('caption') ?? '') });
		}
		redirect(303, `/builds/${build.id}/edit#photos`);
	},
	updatePhoto: async (event) => {
		const { build } = await mine(event);
		const fd = await event.request.formData();
		try {
			await updatePhoto(build.id, Number(fd.get('photoId')), {
				caption: String(fd.get('caption') ?? '')
					.trim()
					.slice(0, 300),
				setupId: Number(fd.get('setupId')) || null
			});
		} catch (e) {
			return plainFailure(e, 'photoProblem');
		}
		redirect(303, `/builds/${build.id}/edit#photos`);
	},
	movePhoto: async (event) => {
		const { build } = await mine(event);
		const fd = await event.request.formData();
		const id = Number(fd.get('photoId'));
		const ids = (await listPhotos(build.id)).map((p) => p.id);
		const i = ids.indexOf(id);
		const j = i + (fd.get('direction') === 'up' ? -1 : 1);
		if (i >= 0 && j >= 0 && j < ids.length) [ids[i], ids[j]] = [ids[j], ids[i]];
		await reorderPhotos(build.id, ids);
		redirect(303, `/builds/${build.id}/edit#photos`);
	},
	removePhoto: async (event) => {
		const { build } = await mine(event);
		await removePhoto(build.id, Number((await event.request.formData()).get('photoId')));
		redirect(303, `/builds/${build.id}/edit#photos`);
	},
	publish: async (event) => {
		const { build } = await mine(event);
		try {
			await publish(build);
		} catch (e) {
			if (!(e instanceof Failure) || e.status !== 400) throw e;
			return fail(400, { publishProblems: e.issues.map((i) => i.message) });
		}
		redirect(303, `/builds/${build.id}`);
	},
	unpublish: async (event) => {
		const { build } = await mine(event);
		await setPublication(build, 'draft');
		redirect(303, `/builds/${build.id}/edit`);
	},
	destroy: async (event) => {
		const { build } = await mine(event);
		await destroyBuild(build.id);
		redirect(303, '/bench');
	}
};
