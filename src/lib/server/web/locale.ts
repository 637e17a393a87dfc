import { AsyncLocalStorage } from 'node:async_hooks';
import type { Handle } from '@sveltejs/kit';
import Negotiator from 'negotiator';
import { readLocaleFrom } from '../../intl';

// Which locale a page's numbers and dates are written in. A signed-in member's pages are their
// own (never shared by a cache): they follow the browser's Accept-Language, the first language
// this server can format. Public pages are shared by caches between readers of every language,
// so they stay en-GB, one text per address. The locale rides with the request (AsyncLocalStorage),
// so loads and rendering of requests in flight at the same time never see each other's.

const current = new AsyncLocalStorage<string>();
readLocaleFrom(() => current.getStore() ?? 'en-GB');

export function negotiatedLocale(acceptLanguage: string | null): string {
	const asked = new Negotiator({
		headers: { 'accept-language': acceptLanguage ?? '' }
	}).languages();
	for (const tag of asked) {
		if (tag === '*') break;
		try {
			const [supported] = Intl.NumberFormat.supportedLocalesOf([tag]);
			if (supported) return supported;
		} catch {
			// not a well-formed language tag: the next one
		}
	}
	return 'en-GB';
}

export const readerLocale: Handle = ({ event, resolve }) => {
	const locale = event.locals.user
		? negotiatedLocale(event.request.headers.get('accept-language'))
		: 'en-GB';
	event.locals.locale = locale;
	return current.run(locale, () => resolve(event));
};
