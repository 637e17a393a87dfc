// Numbers as en-GB writes them, without Intl where a page shows many at start-up: the first Intl
// format a page makes loads the browser's locale data, which costs a slowed phone 130–170 ms of
// main thread before it can answer a tap (measured with tests/perf/page-weight.ts). The output
// matches Intl.NumberFormat('en-GB') exactly (tests/unit/intl.test.ts checks it against Intl).

/** `x` with `digits` decimals and a comma between thousands, as en-GB writes it. */
export function grouped(x: number, digits = 0): string {
	const fixed = Math.abs(x).toFixed(digits);
	const [whole, frac] = fixed.split('.');
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

/** Money in minor units as en-GB writes it ("€129.90"); other currencies through Intl. */
export function money(minor: number, currency: string): string {
	const symbol = SYMBOL[currency];
	if (symbol === undefined)
		return new Intl.NumberFormat('en-GB', { style: 'currency', currency }).format(minor / 100);
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
	return `${d.getDate()} ${MONTHS[d.getMonth()]} ${d.getFullYear()}, ${two(d.getHours())}:${two(d.getMinutes())}`;
}
