import { createHash } from 'node:crypto';
import type { Handle } from '@sveltejs/kit';
import { env } from '../env';

/**
 * What a shared cache may keep: an answer to a GET from someone not signed in, that sets no
 * cookie. It is marked public but to be checked each time (`max-age=0, must-revalidate`), with
 * an ETag — pages get theirs from SvelteKit, JSON here from its bytes — so a reader or a cache
 * that already holds it gets 304 and no body (SvelteKit answers If-None-Match once every handle
 * has run). It varies on the cookie (signed-in readers see more) and on the language (the parts
 * currency follows it). Signed-in answers are left as they are: private by default.
 */
export const publicCache: Handle = async ({ event, resolve }) => {
	const response = await resolve(event);
	if (
		event.request.method !== 'GET' ||
		event.locals.user ||
		response.status !== 200 ||
		response.headers.has('set-cookie') ||
		response.headers.has('cache-control')
	)
		return response;
	const out = new Response(response.body, response);
	// An edge cache in front (nginx, a CDN) may keep it a few seconds (EDGE_CACHE_SECONDS); browsers
	// always ask again.
	const edge = env().EDGE_CACHE_SECONDS;
	out.headers.set(
		'cache-control',
		`public, max-age=0${edge > 0 ? `, s-maxage=${edge}` : ''}, must-revalidate`
	);
	out.headers.append('vary', 'Cookie, Accept-Language');
	if (
		(out.headers.get('content-type') ?? '').includes('application/json') &&
		!out.headers.has('etag')
	) {
		const body = await out.arrayBuffer();
		const tagged = new Response(body, out);
		tagged.headers.set(
			'etag',
			`"${createHash('sha1').update(Buffer.from(body)).digest('base64url')}"`
		);
		return tagged;
	}
	return out;
};
