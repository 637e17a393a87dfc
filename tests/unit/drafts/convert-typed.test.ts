import { describe, expect, it } from 'vitest';
import { convertTyped } from '../../../src/lib/sheet/convert-typed';
import { RUN_FIELDS } from '../../../src/lib/sheet/run-fields';

describe('switching units carries what was typed (NIST SP 811, Appendix B: exact factors)', () => {
	const typed = [
		{ name: 'speed', value: '70' },
		{ name: 'elevation', value: '640' },
		{ name: 'temp', value: '24' },
		{ name: 'method', value: 'radar' },
		{ name: 'speed', value: '' }
	];

	it('converts each number with a dimension at the precision the other system shows', () => {
		const out = convertTyped(RUN_FIELDS, typed, 'metric', 'imperial');
		// 70 km/h ÷ 1.609344 = 43.496 mph → 43.5; 640 m ÷ 0.3048 = 2,099.7 ft → 2100;
		// 24 °C × 1.8 + 32 = 75.2 °F.
		expect(out).toEqual([
			{ name: 'speed', value: '43.5' },
			{ name: 'elevation', value: '2100' },
			{ name: 'temp', value: '75.2' },
			{ name: 'method', value: 'radar' },
			{ name: 'speed', value: '' }
		]);
	});

	it('comes back to what was typed, within the shown precision', () => {
		const there = convertTyped(RUN_FIELDS, typed, 'metric', 'imperial');
		const back = convertTyped(RUN_FIELDS, there, 'imperial', 'metric');
		// 43.5 mph = 70.0 km/h; 2,100 ft = 640.08 m → 640; 75.2 °F = 24.0 °C.
		expect(back.slice(0, 3)).toEqual(typed.slice(0, 3));
	});

	it('leaves what is not a number yet for the form to point out', () => {
		const out = convertTyped(RUN_FIELDS, [{ name: 'speed', value: '7o' }], 'metric', 'imperial');
		expect(out).toEqual([{ name: 'speed', value: '7o' }]);
	});
});
