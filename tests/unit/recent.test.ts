import { describe, expect, it } from 'vitest';
import { recent } from '../../src/lib/recent';

describe('recent results', () => {
	it('makes each result once, and lets the least recently used go when full', () => {
		let made = 0;
		const keep = recent<string>(2);
		const get = (k: string) => keep(k, () => `${k}${++made}`);
		expect(get('a')).toBe('a1');
		expect(get('b')).toBe('b2');
		expect(get('a')).toBe('a1'); // a is now the most recent
		expect(get('c')).toBe('c3'); // b goes
		expect(get('a')).toBe('a1');
		expect(get('b')).toBe('b4');
		expect(made).toBe(4);
	});
});
