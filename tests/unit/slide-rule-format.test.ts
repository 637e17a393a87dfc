import { describe, expect, it } from 'vitest';
import { changeRow, formatResult, row } from '../../src/lib/slide-rule/types';

describe('result rows as printed', () => {
	it('a change carries its sign; a plain value does not', () => {
		expect(formatResult(changeRow('d', 'Density change', 21.43, '%', 1))).toBe('+21.4');
		expect(formatResult(changeRow('d', 'Density change', -8.26, '%', 1))).toBe('\u22128.3');
		expect(formatResult(changeRow('d', 'Density change', -0.01, '%', 1))).toBe('0.0');
		expect(formatResult(row('j', 'Main jet', 92.4, '', 1))).toBe('92.4');
	});
});
