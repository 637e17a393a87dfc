import { describe, expect, it } from 'vitest';
import { safeNext } from '../../src/lib/schemas/account';

// `next` is followed after sign-in. A browser reads a Location header by the WHATWG URL rules
// (https://url.spec.whatwg.org/#concept-basic-url-parser): tabs and newlines are removed and
// `\` counts as `/` in special schemes, so these all name another host.
describe('safeNext keeps sign-in on this site', () => {
	it.each([
		'//evil.example',
		'/\\evil.example',
		'/\t/evil.example',
		'/\n/evil.example',
		'\\\\evil.example',
		'https://evil.example',
		'javascript:alert(1)',
		'/\\/evil.example/path'
	])('refuses %j', (next) => {
		expect(safeNext(next)).toBe('/');
	});

	it('decoded the way SvelteKit hands it over: /%09/evil.example', () => {
		const next = new URLSearchParams('next=/%09/evil.example').get('next');
		expect(safeNext(next)).toBe('/');
	});

	it('keeps a real path with its query and fragment', () => {
		expect(safeNext('/builds/12?tab=runs#r3')).toBe('/builds/12?tab=runs#r3');
		expect(safeNext('/review')).toBe('/review');
		expect(safeNext(null)).toBe('/');
	});
});
