import { afterAll, describe, expect, it, vi } from 'vitest';
import { changePassword } from '../../src/lib/server/accounts/flows';
import { checkPassword } from '../../src/lib/server/auth/password';
import { verifyPasswordSignIn } from '../../src/lib/server/auth/password-signin';
import { closeDb, db } from '../../src/lib/server/db/connection';
import * as users from '../../src/lib/server/auth/users';
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

describe('changing the password from the profile', () => {
	it('needs the current password, then sets the new one and ends every session together', async () => {
		const u = await makeUser({ password: 'old password here' });
		const before = (await users.read(u.id))!;
		expect(await changePassword(u.id, 'not the old one', 'new password here')).toEqual({
			ok: false,
			field: 'current',
			message: 'That is not your current password.'
		});
		expect(await changePassword(u.id, 'old password here', 'new password here')).toEqual({
			ok: true
		});
		const after = (await users.read(u.id))!;
		expect(await checkPassword(after.passwordHash!, 'new password here')).toBe(true);
		expect(after.sessionGeneration).toBe(before.sessionGeneration + 1);
	});

	it('a failure ending the sessions leaves the old password in place', async () => {
		const u = await makeUser({ password: 'old password here' });
		// The password is written first; the session step then fails, so the write must roll back.
		const real = db().query.bind(db());
		const spy = vi.spyOn(db(), 'query').mockImplementation(((sql: unknown, ...rest: unknown[]) => {
			if (String(sql).includes('session_generation = session_generation + 1'))
				return Promise.reject(new Error('lost connection'));
			return (real as (...a: unknown[]) => unknown)(sql, ...rest);
		}) as never);
		try {
			await expect(changePassword(u.id, 'old password here', 'new password here')).rejects.toThrow(
				'lost connection'
			);
		} finally {
			spy.mockRestore();
		}
		const after = (await users.read(u.id))!;
		expect(await checkPassword(after.passwordHash!, 'old password here')).toBe(true);
	});
});
