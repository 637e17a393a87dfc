import type { RequestEvent } from '@sveltejs/kit';
import type { Units } from '../../sheet/units';

/** ?units= on the link wins, then the reader's profile, then metric. */
export function unitsFor(event: RequestEvent): Units {
	const q = event.url.searchParams.get('units');
	if (q === 'metric' || q === 'imperial') return q;
	return event.locals.user?.units ?? 'metric';
}

// The currency most readers in a region price parts in; anywhere else, euros.
const REGION_CURRENCY: Record<string, string> = {
	GB: 'GBP',
	US: 'USD',
	CH: 'CHF',
	LI: 'CHF',
	SE: 'SEK',
	PL: 'PLN',
	CA: 'CAD',
	AU: 'AUD'
};

/** ?currency= on the link wins, then the region of the browser's first language, then EUR. */
export function currencyFor(event: RequestEvent): string {
	const q = event.url.searchParams.get('currency');
	if (q && Object.values(REGION_CURRENCY).concat('EUR').includes(q)) return q;
	const first = (event.request.headers.get('accept-language') ?? '').split(',')[0].trim();
	const region = first.split(';')[0].split('-')[1]?.toUpperCase();
	return (region && REGION_CURRENCY[region]) || 'EUR';
}
