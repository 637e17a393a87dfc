import { median } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { summarise, type LinkedBuild } from '../../../src/lib/shops/summary';

const b = (cc: number | null, bestKmh: number | null, partsMinor: number, currency = 'EUR') =>
	({ id: 0, title: '', kind: 'built', cc, bestKmh, partsMinor, currency }) as LinkedBuild;

describe('shop summary', () => {
	it('takes medians per displacement class and per currency, leaving out what is missing', () => {
		const s = summarise([
			b(49.5, 45, 0),
			b(68, 80, 40000),
			b(70, 90, 60000),
			b(70, 100, 50000),
			b(72, null, 30000, 'GBP'),
			b(null, 95, 0)
		]);
		expect(s.builds).toBe(6);
		// Median of an odd count is the middle value, of an even count the mean of the middle two
		// (the textbook definition; checked against simple-statistics, a reference library).
		expect(s.speedByClass).toEqual([
			{ label: 'up to 50 cc', builds: 1, medianKmh: 45 },
			{ label: '51–70 cc', builds: 3, medianKmh: 90 }
		]);
		expect(median([80, 90, 100])).toBe(90);
		expect(s.costByCurrency).toEqual([
			{ currency: 'EUR', builds: 3, medianMinor: 50000 },
			{ currency: 'GBP', builds: 1, medianMinor: 30000 }
		]);
	});

	it('an even count takes the mean of the middle two; classes without builds are not listed', () => {
		const s = summarise([b(90, 100, 1000), b(85, 110, 2001)]);
		expect(s.speedByClass).toEqual([{ label: '71–90 cc', builds: 2, medianKmh: 105 }]);
		// (1000 + 2001) / 2 = 1500.5, rounded to whole minor units.
		expect(s.costByCurrency).toEqual([{ currency: 'EUR', builds: 2, medianMinor: 1501 }]);
	});

	it('an empty shop has no figures', () => {
		expect(summarise([])).toEqual({ builds: 0, speedByClass: [], costByCurrency: [] });
	});
});
