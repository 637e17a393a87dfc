import { error } from '@sveltejs/kit';
import { readBuild } from '$lib/server/sheet/access';
import { readPhoto } from '$lib/server/sheet/photos';
import { getObjectForReader } from '$lib/server/storage/objects';
import type { RequestHandler } from './$types';

// Photos are served through the app, so a draft's photos follow the draft's access rule: others get 404.
export const GET: RequestHandler = async (event) => {
	const photo = await readPhoto(Number(event.params.id));
	if (!photo || !['display', 'thumb'].includes(event.params.size)) error(404, 'No such photo.');
	const { build } = await readBuild(event, photo.buildId);
	const open = build.publication === 'published' && build.moderation === 'visible';
	const obj = await getObjectForReader(
		event.params.size === 'thumb' ? photo.thumbKey : photo.displayKey
	);
	if (!obj) error(404, 'No such photo.');
	return new Response(obj.body, {
		headers: {
			'content-type': obj.contentType,
			'cache-control': open ? 'public, max-age=3600' : 'private, no-store',
			'x-content-type-options': 'nosniff'
		}
	});
};
