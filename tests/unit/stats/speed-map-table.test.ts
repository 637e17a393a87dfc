import { parseHTML } from 'linkedom';
import { describe, expect, it } from 'vitest';
import type { SpeedMap } from '../../../src/lib/server/stats/speed-map';
import { speedMapRows } from '../../../src/lib/stats/speed-map-table';

const base = { total: 2, trend: null, trendHidden: null } as const;

// The table's rows are markup the page inserts as it is: read back through a DOM, cell by cell.
const cells = (html: string) => {
	const { document } = parseHTML(`<table><tbody>${html}</tbody></table>`);
	return [...document.querySelectorAll('tr')].map((tr) =>
		[...tr.querySelectorAll('td')].map((td) => td.textContent)
	);
};

describe('the speed map as a table', () => {
	it('keeps a member’s title as words, never as markup', () => {
		const map: SpeedMap = {
			...base,
			x: 'final-drive',
			mode: 'points',
			bins: [],
			points: [
				{
					setupId: 1,
					buildId: 7,
					title: '<img src=x onerror=alert(1)> & co',
					x: 11.5,
					kmh: 80,
					pipe: 'sport'
				}
			]
		};
		const html = speedMapRows(map, 'metric');
		expect(html).not.toContain('<img');
		expect(cells(html)).toEqual([
			['<img src=x onerror=alert(1)> & co', '11.50:1', 'sport silencer', '80.0 km/h']
		]);
		const { document } = parseHTML(`<table><tbody>${html}</tbody></table>`);
		expect(document.querySelector('a')?.getAttribute('href')).toBe('/builds/7');
	});

	it('shows bins in the reader’s units (1 mile = 1,609.344 m, 1 ft = 0.3048 m: NIST SP 811, Appendix B)', () => {
		const map: SpeedMap = {
			...base,
			x: 'elevation',
			mode: 'bins',
			points: [],
			bins: [{ x: 1000, x2: 1100, y: 80, y2: 82, pipe: 'expansion-chamber', n: 12 }]
		};
		// 80 km/h = 80 / 1.609344 = 49.71 mph; 1,000 m = 1000 / 0.3048 = 3,280.8 ft.
		expect(cells(speedMapRows(map, 'imperial'))).toEqual([
			['3281 ft', 'expansion chamber', '49.7 mph', '12']
		]);
		expect(cells(speedMapRows(map, 'metric'))).toEqual([
			['1000 m', 'expansion chamber', '80.0 km/h', '12']
		]);
	});
});
