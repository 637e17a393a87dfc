import { afterAll, describe, expect, it } from 'vitest';
import { verifyPasswordSignIn } from '../../src/lib/server/auth/password-signin';
import { closeDb } from '../../src/lib/server/db/connection';
import * as users from '../../src/lib/server/db/users';
import { makeUser } from '../support/factories';

let n = 0;
/** A fresh client address per call: these tests are about the per-account rules. */
const nextAddress = () => `192.0.2.${++n}`;

afterAll(closeDb);

describe('password sign-in gate', () => {
	it('accepts the right password and refuses a wrong one without saying which part was wrong', async () => {
		const u = await makeUser();
		expect(await verifyPasswordSignIn(u.email, u.password, nextAddress())).toMatchObject({
			ok: true,
			user: { id: u.id }
		});
		expect(await verifyPasswordSignIn(u.email, 'not the password', nextAddress())).toEqual({
			ok: false,
			code: 'credentials'
		});
		expect(
			await verifyPasswordSignIn('nobody@tests.squishline.test', 'whatever12', nextAddress())
		).toEqual({
			ok: false,
			code: 'credentials'
		});
	});

	it('is case-insensitive on the address', async () => {
		const u = await makeUser();
		expect((await verifyPasswordSignIn(u.email.toUpperCase(), u.password, nextAddress())).ok).toBe(
			true
		);
	});

	it('locks an account after five wrong passwords, even for the right one', async () => {
		const u = await makeUser();
		for (let i = 0; i < 5; i++) {
			expect((await verifyPasswordSignIn(u.email, `wrong guess ${i}`, nextAddress())).ok).toBe(
				false
			);
		}
		expect(await verifyPasswordSignIn(u.email, u.password, nextAddress())).toEqual({
			ok: false,
			code: 'rate-limited'
		});
		// Another account is untouched by the first one's lock.
		const other = await makeUser();
		expect((await verifyPasswordSignIn(other.email, other.password, nextAddress())).ok).toBe(true);
	});

	it('a right password clears earlier failures', async () => {
		const u = await makeUser();
		for (let i = 0; i < 4; i++) await verifyPasswordSignIn(u.email, `wrong ${i}`, nextAddress());
		expect((await verifyPasswordSignIn(u.email, u.password, nextAddress())).ok).toBe(true);
		for (let i = 0; i < 4; i++)
			await verifyPasswordSignIn(u.email, `wrong again ${i}`, nextAddress());
		expect((await verifyPasswordSignIn(u.email, u.password, nextAddress())).ok).toBe(true);
	});

	it('lets a suspended member in (read-only) and refuses an unconfirmed account with its reason', async () => {
		const s = await makeUser();
		await users.update(s.id, { suspendedAt: new Date(), suspendedReason: 'test' });
		expect((await verifyPasswordSignIn(s.email, s.password, nextAddress())).ok).toBe(true);
		const n = await makeUser({ verified: false });
		expect(await verifyPasswordSignIn(n.email, n.password, nextAddress())).toEqual({
			ok: false,
			code: 'unverified'
		});
	});
});
