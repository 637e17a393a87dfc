import { error } from '@sveltejs/kit';
import { viewShop } from '$lib/server/shops/access';
import { getObjectForReader } from '$lib/server/storage/objects';
import type { RequestHandler } from './$types';

// Served through the app so a page the desk took down takes its logo with it.
export const GET: RequestHandler = async (event) => {
	const { shop } = await viewShop(Number(event.params.id), event.locals.user);
	const obj = shop.logoKey ? await getObjectForReader(shop.logoKey) : null;
	if (!obj) error(404, 'No logo.');
	return new Response(obj.body, {
		headers: {
			'content-type': obj.contentType,
			'cache-control': 'public, max-age=600',
			'x-content-type-options': 'nosniff'
		}
	});
};
