import { createHash } from 'node:crypto';

// A kept answer (stats/kept.ts) is the same object while nothing changes; its JSON and ETag are
// made once for it, not serialised and hashed again on every request (the speed map's bins run
// to hundreds of kilobytes). public-cache.ts leaves an ETag it finds in place.
const made = new WeakMap<object, { body: string; etag: string }>();

export function keptJson(value: object): Response {
	let m = made.get(value);
	if (!m) {
		const body = JSON.stringify(value);
		m = { body, etag: `"${createHash('sha1').update(body).digest('base64url')}"` };
		made.set(value, m);
	}
	return new Response(m.body, {
		headers: { 'content-type': 'application/json', etag: m.etag }
	});
}
