import { error } from '@sveltejs/kit';
import { readBuild } from '$lib/server/sheet/access';
import { readPhoto } from '$lib/server/sheet/photos';
import { getObjectForReader } from '$lib/server/storage/objects';
import type { RequestHandler } from './$types';

// A draft's photos come through the app, so they follow the draft's access rule: others get 404.
// (A published sheet's page links its photos straight from the store; this route serves them too,
// for links kept from before.) A photo's key is never reused, so the key is its ETag: a reader
// who has it gets 304 without the store being asked.
export const GET: RequestHandler = async (event) => {
	const photo = await readPhoto(Number(event.params.id));
	if (!photo || !['display', 'thumb'].includes(event.params.size)) error(404, 'No such photo.');
	const { build } = await readBuild(event, photo.buildId);
	const open = build.publication === 'published' && build.moderation === 'visible';
	const key = event.params.size === 'thumb' ? photo.thumbKey : photo.displayKey;
	const etag = `"${key.split('/').at(-1)}"`;
	const headers = {
		etag,
		// Not for good here: a shared cache must notice within the hour when the desk takes it down.
		'cache-control': open ? 'public, max-age=3600' : 'private, no-cache',
		'x-content-type-options': 'nosniff'
	};
	const asked = event.request.headers.get('if-none-match') ?? '';
	if (asked.split(',').some((t) => t.trim().replace(/^W\//, '') === etag))
		return new Response(null, { status: 304, headers });
	const obj = await getObjectForReader(key);
	if (!obj) error(404, 'No such photo.');
	return new Response(obj.body, { headers: { ...headers, 'content-type': obj.contentType } });
};
