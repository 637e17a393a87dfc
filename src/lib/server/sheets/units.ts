import type { RequestEvent } from '@sveltejs/kit';
import type { Units } from '../../sheet/units';

/** ?units= on the link wins, then the reader's profile, then metric. */
export function unitsFor(event: RequestEvent): Units {
	const q = event.url.searchParams.get('units');
	if (q === 'metric' || q === 'imperial') return q;
	return event.locals.user?.units ?? 'metric';
}
