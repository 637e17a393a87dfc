import { afterAll, describe, expect, it } from 'vitest';
import * as tokens from '../../src/lib/server/auth/email-tokens';
import { closeDb } from '../../src/lib/server/db/connection';
import { models } from '../../src/lib/server/db/models';
import { makeUser } from '../support/factories';

afterAll(closeDb);

describe('mailed single-use tokens', () => {
	it('works once, then reports it was used', async () => {
		const u = await makeUser();
		const t = await tokens.issue(u.id, 'reset');
		expect(await tokens.consume(t, 'reset')).toEqual({ ok: true, userId: u.id });
		expect(await tokens.consume(t, 'reset')).toEqual({ ok: false, reason: 'used' });
	});

	it('of two concurrent uses only one wins', async () => {
		const u = await makeUser();
		const t = await tokens.issue(u.id, 'verify');
		const results = await Promise.all([tokens.consume(t, 'verify'), tokens.consume(t, 'verify')]);
		expect(results.filter((r) => r.ok)).toHaveLength(1);
	});

	it('refuses an expired token, one for another purpose, and a forged one', async () => {
		const u = await makeUser();
		const t = await tokens.issue(u.id, 'reset');
		expect(await tokens.consume(t, 'verify')).toEqual({ ok: false, reason: 'unknown' });
		await models().EmailToken.update(
			{ expiresAt: new Date(Date.now() - 1000) },
			{ where: { userId: u.id } }
		);
		expect(await tokens.consume(t, 'reset')).toEqual({ ok: false, reason: 'expired' });
		expect(await tokens.inspect('forged-token-value', 'reset')).toEqual({
			ok: false,
			reason: 'unknown'
		});
	});

	it('stores only a hash of the token', async () => {
		const u = await makeUser();
		const t = await tokens.issue(u.id, 'verify');
		const row = await models().EmailToken.findOne({ where: { userId: u.id } });
		expect(row?.tokenHash).toMatch(/^[0-9a-f]{64}$/);
		expect(row?.tokenHash).not.toContain(t);
	});
});
