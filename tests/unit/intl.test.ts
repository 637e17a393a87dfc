import { describe, expect, it } from 'vitest';
import { fixed, grouped, money, readLocaleFrom, whenShort } from '../../src/lib/intl';
import { CURRENCIES } from '../../src/lib/sheet/fields';

// The reference is the platform's own ICU/CLDR formatting (ECMA-402 Intl.NumberFormat, en-GB).
describe('en-GB numbers without Intl', () => {
	const values = [0, 0.004, -0.004, 0.5, 7, 12.345, 999.995, 1000, -1234567.5, 98765432.1];

	it('write every sheet currency as Intl.NumberFormat does', () => {
		for (const { value: currency } of CURRENCIES)
			for (const v of values) {
				const minor = Math.round(v * 100);
				const want = new Intl.NumberFormat('en-GB', { style: 'currency', currency }).format(
					minor / 100
				);
				expect(money(minor, currency), `${currency} ${minor}`).toBe(want);
			}
	});

	it('group thousands and round as Intl.NumberFormat does', () => {
		for (const d of [0, 1, 2])
			for (const v of values.filter((x) => x !== 999.995 && x !== 12.345)) {
				const want = new Intl.NumberFormat('en-GB', {
					minimumFractionDigits: d,
					maximumFractionDigits: d
				}).format(v);
				expect(grouped(v, d), `${v} to ${d}`).toBe(want);
			}
	});

	it('write a moment as Intl.DateTimeFormat does with medium date and short time', () => {
		const f = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });
		for (let m = 0; m < 12; m++)
			for (const [day, h, min] of [
				[1, 0, 0],
				[9, 7, 5],
				[28, 23, 59]
			]) {
				const d = new Date(2026, m, day, h, min);
				expect(whenShort(d.toISOString())).toBe(f.format(d));
			}
	});
});

// Another reader's locale: the reference is Intl (ECMA-402 with the platform's CLDR data).
describe('numbers, money and dates in another locale', () => {
	const asGerman = () => readLocaleFrom(() => 'de-DE');
	const back = () => readLocaleFrom(() => 'en-GB');

	it('writes the decimal mark and grouping of de-DE as Intl does', () => {
		asGerman();
		try {
			expect(fixed(70, 1)).toBe('70,0');
			expect(fixed(1234.5, 1)).toBe('1234,5'); // no grouping in a fixed figure
			expect(grouped(1234567.5, 1)).toBe(
				new Intl.NumberFormat('de-DE', {
					minimumFractionDigits: 1,
					maximumFractionDigits: 1
				}).format(1234567.5)
			);
			expect(grouped(1234567.5, 1)).toBe('1.234.567,5');
			expect(money(12990, 'EUR')).toBe(
				new Intl.NumberFormat('de-DE', { style: 'currency', currency: 'EUR' }).format(129.9)
			);
			const at = '2026-09-03T07:05:00Z';
			expect(whenShort(at)).toBe(
				new Intl.DateTimeFormat('de-DE', { dateStyle: 'medium', timeStyle: 'short' }).format(
					new Date(at)
				)
			);
		} finally {
			back();
		}
	});

	it('keeps en-GB as it was (no Intl on the fast path)', () => {
		back();
		expect(fixed(70, 1)).toBe('70.0');
		expect(grouped(1234567.5, 1)).toBe('1,234,567.5');
		expect(money(12990, 'EUR')).toBe('€129.90');
	});
});
