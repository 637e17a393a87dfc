// The builds list's sort choices and its query string: no zod, so the page's scripts stay small.

export const SORTS = [
	{ value: 'newest', label: 'newest first' },
	{ value: 'fastest', label: 'fastest first' },
	{ value: 'cheapest', label: 'cheapest parts first' }
] as const;

/** The query string for a list state (empty values left out), for links and fetches. */
export function listParams(q: Record<string, unknown>, drop: string[] = []) {
	const p = new URLSearchParams();
	for (const [k, v] of Object.entries(q))
		if (v !== undefined && v !== null && v !== '' && !drop.includes(k)) p.set(k, String(v));
	return p;
}
