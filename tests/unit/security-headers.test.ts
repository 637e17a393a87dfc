import { describe, expect, it } from 'vitest';
import { allowStoreImages } from '../../src/lib/server/web/security-headers';

// The CSP grammar: W3C Content Security Policy Level 3, §2.2 (directives separated by ";").
describe('the store in img-src', () => {
	const csp = "default-src 'self'; img-src 'self' data: blob:; font-src 'self'";

	it('joins img-src only, as an origin, once', () => {
		const out = allowStoreImages(csp, 'https://photos.example.net/bucket/x');
		expect(out).toBe(
			"default-src 'self'; img-src 'self' data: blob: https://photos.example.net; font-src 'self'"
		);
		expect(allowStoreImages(out, 'https://photos.example.net')).toBe(out);
	});

	it('leaves a policy without img-src as it was', () => {
		expect(allowStoreImages("default-src 'self'", 'http://127.0.0.1:4569')).toBe(
			"default-src 'self'"
		);
	});
});
