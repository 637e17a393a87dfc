// Numbers and dates in the reader's locale. A member's pages follow their browser's languages
// (Accept-Language, `web/locale.ts`); public pages, which caches share between readers, are
// written as en-GB. en-GB is written here without Intl: the first Intl format a page makes loads
// the browser's locale data, which costs a slowed phone 130–170 ms of main thread before it can
// answer a tap (measured with tests/perf/page-weight.ts), so only readers of another locale pay
// it. The en-GB output matches Intl.NumberFormat('en-GB') exactly (tests/unit/intl.test.ts).

let localeOf: () => string = () => 'en-GB';

/** Where the locale comes from: the request on the server, the page's data in the browser. */
export function readLocaleFrom(source: () => string): void {
	localeOf = source;
}

const EN_GB = 'en-GB';
const formats = new Map<string, Intl.NumberFormat>();
function numberFormat(locale: string, digits: number, grouping: boolean): Intl.NumberFormat {
	const key = `${locale}|${digits}|${grouping}`;
	let f = formats.get(key);
	if (!f) {
		f = new Intl.NumberFormat(locale, {
			minimumFractionDigits: digits,
			maximumFractionDigits: digits,
			useGrouping: grouping
		});
		formats.set(key, f);
	}
	return f;
}

/** `x` with `digits` decimals, no grouping: the reader's decimal mark ("70.0", "70,0"). */
export function fixed(x: number, digits = 0): string {
	const locale = localeOf();
	return locale === EN_GB ? x.toFixed(digits) : numberFormat(locale, digits, false).format(x);
}

/** `x` with `digits` decimals and thousands grouped, as the reader's locale writes it. */
export function grouped(x: number, digits = 0): string {
	const locale = localeOf();
	if (locale !== EN_GB) return numberFormat(locale, digits, true).format(x);
	const [whole, frac] = Math.abs(x).toFixed(digits).split('.');
	const body = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',') + (frac ? `.${frac}` : '');
	// A negative value keeps its sign even when it rounds to zero ("-0"), as Intl's does.
	return x < 0 || Object.is(x, -0) ? `-${body}` : body;
}

// What en-GB puts before an amount in each currency the sheets offer (CLDR, as Intl gives it;
// the space after a code is a no-break space).
const SYMBOL: Record<string, string> = {
	EUR: '€',
	GBP: '£',
	USD: 'US$',
	CHF: 'CHF\u00a0',
	SEK: 'SEK\u00a0',
	PLN: 'PLN\u00a0',
	CAD: 'CA$',
	AUD: 'A$'
};

/** Money in minor units as the reader's locale writes it ("€129.90", "129,90 €"). */
export function money(minor: number, currency: string): string {
	const locale = localeOf();
	const symbol = locale === EN_GB ? SYMBOL[currency] : undefined;
	if (symbol === undefined)
		return new Intl.NumberFormat(locale, { style: 'currency', currency }).format(minor / 100);
	const text = grouped(minor / 100, 2);
	return text.startsWith('-') ? `-${symbol}${text.slice(1)}` : `${symbol}${text}`;
}

// en-GB's short month names (CLDR, as Intl gives them with dateStyle "medium").
const MONTHS = [
	'Jan',
	'Feb',
	'Mar',
	'Apr',
	'May',
	'Jun',
	'Jul',
	'Aug',
	'Sept',
	'Oct',
	'Nov',
	'Dec'
];
const two = (n: number) => String(n).padStart(2, '0');

/**
 * A moment as en-GB writes it with dateStyle "medium" and timeStyle "short" ("3 Sept 2026, 07:05"),
 * in the reader's time zone; the same text on the server and in every browser.
 */
export function whenShort(iso: string): string {
	const d = new Date(iso);
	const locale = localeOf();
	if (locale !== EN_GB)
		return new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short' }).format(d);
	return `${d.getDate()} ${MONTHS[d.getMonth()]} ${d.getFullYear()}, ${two(d.getHours())}:${two(d.getMinutes())}`;
}
