import { describe, expect, it } from 'vitest';
import { linksIn } from '../../src/lib/server/mail/outbox';

describe('outbox links', () => {
	it('finds each link in a mail once', () => {
		const text =
			'Confirm: http://127.0.0.1:3000/verify/abc_DEF-1\n\nor http://127.0.0.1:3000/verify/abc_DEF-1 again';
		expect(linksIn(text)).toEqual(['http://127.0.0.1:3000/verify/abc_DEF-1']);
		expect(linksIn('no links here')).toEqual([]);
	});
});
