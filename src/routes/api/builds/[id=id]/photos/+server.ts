import { json } from '@sveltejs/kit';
import { api, Failure } from '$lib/server/api';
import { requireUser } from '$lib/server/guard';
import { createOnce } from '$lib/server/web/idempotency';
import { editBuild, readBuild } from '$lib/server/sheet/access';
import { addPhoto, listPhotos, PHOTO_MAX_BYTES } from '$lib/server/sheet/photos';
import type { RequestHandler } from './$types';

const view = (p: Awaited<ReturnType<typeof listPhotos>>[number]) => ({
	id: p.id,
	caption: p.caption,
	sourceFormat: p.sourceFormat,
	position: p.position,
	setupId: p.setupId,
	width: p.width,
	height: p.height,
	display: `/api/photos/${p.id}/display`,
	thumb: `/api/photos/${p.id}/thumb`
});

export const GET: RequestHandler = api(async (event) => {
	const { build } = await readBuild(event, Number(event.params.id));
	return json({ photos: (await listPhotos(build.id)).map(view) });
});

/** multipart/form-data with `file`, optional `caption` and `setupId`. */
export const POST: RequestHandler = api(async (event) => {
	const { build } = await editBuild(event, Number(event.params.id));
	// Refuse an oversize body before reading it (the route's own limit, below the server's).
	if (Number(event.request.headers.get('content-length') ?? 0) > PHOTO_MAX_BYTES + 64 * 1024)
		throw new Failure(413, 'That photo is over 15 MB. Export it smaller and try again.');
	if (!(event.request.headers.get('content-type') ?? '').startsWith('multipart/form-data'))
		throw new Failure(415, 'Send the photo as multipart/form-data with a "file" field.');
	const fd = await event.request.formData();
	const file = fd.get('file');
	if (!(file instanceof File) || file.size === 0)
		throw new Failure(422, 'Choose a photo to upload.', [{ path: 'file', message: 'Needed.' }]);
	const setupId = Number(fd.get('setupId')) || null;
	const caption = String(fd.get('caption') ?? '');
	// A photo kept offline is sent with a key: sent again after a lost answer, it is stored once.
	const sent = { caption, setupId, name: file.name, size: file.size };
	return createOnce(event.request, requireUser(event).id, sent, async () =>
		view(await addPhoto(build.id, new Uint8Array(await file.arrayBuffer()), { caption, setupId }))
	);
});
