import type { Handle } from '@sveltejs/kit';
import { env } from '../env';

// SvelteKit's own cross-site form check, kept as it is with one exception: a mail provider's
// one-click unsubscribe (RFC 8058 §3.1) POSTs `List-Unsubscribe=One-Click` to the link in the
// List-Unsubscribe header, from its own servers and with no Origin. The signed token in that
// path is the permission, and all it can do is turn one kind of mail off.

const FORM_TYPES = [
	'application/x-www-form-urlencoded',
	'multipart/form-data',
	'text/plain',
	'application/x-sveltekit-formdata'
];
const WRITES = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
const ONE_CLICK = /^\/unsubscribe\/[A-Za-z0-9_.-]+$/;

function isForm(request: Request): boolean {
	const type = request.headers.get('content-type')?.split(';', 1)[0].trim().toLowerCase() ?? '';
	return FORM_TYPES.includes(type);
}

/** True when a request is a cross-site form submission that must be refused. */
export function crossSiteForm(request: Request, url: URL): boolean {
	if (!WRITES.has(request.method) || !isForm(request)) return false;
	if (request.headers.get('origin') === url.origin) return false;
	return !(request.method === 'POST' && ONE_CLICK.test(url.pathname));
}

export const originCheck: Handle = ({ event, resolve }) => {
	if (crossSiteForm(event.request, event.url)) {
		const message = `Cross-site ${event.request.method} form submissions are forbidden`;
		return event.request.headers.get('accept') === 'application/json'
			? Response.json({ message }, { status: 403 })
			: new Response(message, { status: 403 });
	}
	return resolve(event);
};

// Headers a client can send to make the app think it lives elsewhere. The site's address is
// ORIGIN, set by whoever runs it; every link we build (mail included) starts from it. The client
// address behind a proxy is adapter-node's ADDRESS_HEADER / XFF_DEPTH, a separate setting.
const HOST_HINTS = ['x-forwarded-host', 'x-forwarded-proto', 'x-forwarded-server', 'forwarded'];

/** Drops host hints and pins Host to ORIGIN before Auth.js or any route reads them. */
export const pinHost: Handle = ({ event, resolve }) => {
	const headers = event.request.headers;
	for (const h of HOST_HINTS) headers.delete(h);
	headers.set('host', new URL(env().ORIGIN).host);
	return resolve(event);
};
