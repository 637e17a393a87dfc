import type { Handle } from '@sveltejs/kit';
import { env } from '../env';
import { publicStoreUrl } from '../storage/links';

// Headers every response carries. The Content-Security-Policy itself comes from kit.csp in
// svelte.config.js (it needs the hashes of each page's inline scripts); this adds the rest.

const PERMISSIONS = [
	'camera=()',
	'microphone=()',
	'geolocation=()',
	'payment=()',
	'usb=()',
	'browsing-topics=()'
].join(', ');

export function securityHeaders(origin: string): Record<string, string> {
	const headers: Record<string, string> = {
		'x-content-type-options': 'nosniff',
		'referrer-policy': 'strict-origin-when-cross-origin',
		'permissions-policy': PERMISSIONS,
		// For browsers that predate CSP frame-ancestors.
		'x-frame-options': 'DENY',
		'cross-origin-opener-policy': 'same-origin'
	};
	if (origin.startsWith('https:'))
		headers['strict-transport-security'] = 'max-age=31536000; includeSubDomains';
	return headers;
}

/**
 * kit.csp is fixed at build time, but where the object store lives is a setting: its origin joins
 * img-src here, so published photos linked straight from the store may load.
 */
export function allowStoreImages(csp: string, store: string): string {
	const origin = new URL(store).origin;
	return csp.replace(/(^|;\s*)img-src([^;]*)/, (m) => (m.includes(origin) ? m : `${m} ${origin}`));
}

export const withSecurityHeaders: Handle = async ({ event, resolve }) => {
	const response = await resolve(event);
	const extra = securityHeaders(env().ORIGIN);
	const csp = response.headers.get('content-security-policy');
	if (csp) extra['content-security-policy'] = allowStoreImages(csp, publicStoreUrl());
	try {
		for (const [k, v] of Object.entries(extra)) response.headers.set(k, v);
		return response;
	} catch {
		// Some responses (Response.redirect) have immutable headers: copy them.
		const copy = new Response(response.body, response);
		for (const [k, v] of Object.entries(extra)) copy.headers.set(k, v);
		return copy;
	}
};
