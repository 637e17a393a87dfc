import type { Handle } from '@sveltejs/kit';

// Each route reads at most what its form needs. adapter-node's BODY_SIZE_LIMIT is the ceiling
// for all (the largest, a photo upload); these caps answer sooner, before anything is read.

const KB = 1024;
const MB = 1024 * KB;

const CAPS: [RegExp, number][] = [
	// A photo (15 MB) or a shop logo, with the multipart envelope around it.
	[/^\/api\/builds\/\d+\/photos$/, 16 * MB],
	[/^\/builds\/\d+\/edit$/, 16 * MB],
	[/^\/shop$/, 16 * MB],
	// An exported build sheet being brought back in.
	[/^\/api\/builds\/import$/, 6 * MB],
	[/^\/builds\/new$/, 6 * MB]
];
export const DEFAULT_CAP = 256 * KB;

export function bodyCap(pathname: string): number {
	return CAPS.find(([re]) => re.test(pathname))?.[1] ?? DEFAULT_CAP;
}

export function sizeText(bytes: number): string {
	return bytes >= MB ? `${Math.round(bytes / MB)} MB` : `${Math.round(bytes / KB)} kB`;
}

export function tooLargeMessage(cap: number): string {
	return `That is more than this page accepts (at most ${sizeText(cap)}). Nothing was saved.`;
}

/** 413 with words when the declared length is over the route's cap; the body is never read. */
export const bodyLimit: Handle = ({ event, resolve }) => {
	const length = Number(event.request.headers.get('content-length') ?? 0);
	const cap = bodyCap(event.url.pathname);
	if (length > cap) {
		const message = tooLargeMessage(cap);
		const wantsJson =
			event.url.pathname.startsWith('/api/') ||
			event.request.headers.get('accept')?.includes('application/json');
		// Connection: close, so no client reuses a socket whose unread body is still arriving.
		return wantsJson
			? Response.json(
					{ error: message, issues: [] },
					{ status: 413, headers: { connection: 'close' } }
				)
			: new Response(message, {
					status: 413,
					headers: { 'content-type': 'text/plain; charset=utf-8', connection: 'close' }
				});
	}
	return resolve(event);
};
