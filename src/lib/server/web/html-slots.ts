import type { Handle, RequestEvent } from '@sveltejs/kit';

// Markup a page shows but its script never needs — the speed map's server-drawn chart, hundreds
// of kilobytes — is dropped into the HTML after rendering, at a comment the page leaves for it,
// instead of travelling twice (once as HTML, once again in the page's serialised data). The page
// renders the comment with {@html}; on hydration Svelte keeps what the server sent there.

const SLOT = /<!--slot:([a-z][a-z-]*)-->/g;

/** The placeholder a page renders with {@html}, and the markup the server puts after it. */
export function slot(event: RequestEvent, name: string, markup: string): string {
	(event.locals.htmlSlots ??= {})[name] = markup;
	return `<!--slot:${name}-->`;
}

export const htmlSlots: Handle = ({ event, resolve }) =>
	resolve(event, {
		// The comment stays (Svelte counts on the page's comments); the markup follows it.
		transformPageChunk: ({ html }) =>
			event.locals.htmlSlots
				? html.replace(SLOT, (m, name: string) => m + (event.locals.htmlSlots?.[name] ?? ''))
				: html
	});
