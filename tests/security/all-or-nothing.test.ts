import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { resetPassword } from '../../src/lib/server/accounts/flows';
import { endSessionsOf } from '../../src/lib/server/admin/users';
import * as tokens from '../../src/lib/server/auth/email-tokens';
import { checkPassword } from '../../src/lib/server/auth/password';
import { closeDb, db } from '../../src/lib/server/db/connection';
import { models } from '../../src/lib/server/db/models';
import * as users from '../../src/lib/server/auth/users';
import { makeUser } from '../support/factories';

afterAll(closeDb);

const generation = async (id: string) =>
	(
		await db().query<{ g: number }>('SELECT session_generation AS g FROM users WHERE id = ?', {
			replacements: [id],
			type: QueryTypes.SELECT
		})
	)[0].g;

describe('a password reset is all or nothing', () => {
	it('a failure after the new password was written leaves the old password, the link and the sessions as they were', async () => {
		const u = await makeUser({ verified: false });
		const token = await tokens.issue(u.id, 'reset');
		const genBefore = await generation(u.id);
		// Break the step after the password: confirming the address.
		const { User } = models();
		User.addHook('beforeBulkUpdate', 'break-midway', (options) => {
			// Sequelize passes the values being written as `attributes` on a bulk update.
			const values = (options as { attributes?: object }).attributes;
			if (values && 'emailVerified' in values) throw new Error('injected failure');
		});
		try {
			await expect(resetPassword(token, 'the new password 42')).rejects.toThrow('injected failure');
		} finally {
			User.removeHook('beforeBulkUpdate', 'break-midway');
		}
		const row = (await users.read(u.id))!;
		expect(await checkPassword(row.passwordHash, u.password)).toBe(true);
		expect(await checkPassword(row.passwordHash, 'the new password 42')).toBe(false);
		expect(row.emailVerified).toBeNull();
		expect(await generation(u.id)).toBe(genBefore);
		expect((await tokens.inspect(token, 'reset')).ok).toBe(true);

		// The same link then works, and does all of it.
		expect((await resetPassword(token, 'the new password 42')).ok).toBe(true);
		const after = (await users.read(u.id))!;
		expect(await checkPassword(after.passwordHash, 'the new password 42')).toBe(true);
		expect(after.emailVerified).not.toBeNull();
		expect(await generation(u.id)).toBe(genBefore + 1);
		expect((await tokens.inspect(token, 'reset')).ok).toBe(false);
	});
});

describe("an admin's sign-out-everywhere is logged or not done", () => {
	it('a log write that fails leaves the sessions as they were', async () => {
		const admin = await makeUser({ role: 'admin' });
		const target = await makeUser();
		const before = await generation(target.id);
		const me = {
			id: admin.id,
			email: admin.email,
			name: 'Admin',
			role: 'admin' as const,
			units: 'metric' as const,
			theme: 'device' as const,
			suspension: null
		};
		const { LogEntry } = models();
		LogEntry.addHook('beforeCreate', 'break-log', () => {
			throw new Error('injected failure');
		});
		try {
			await expect(endSessionsOf(me, target.id, new Date())).rejects.toThrow('injected failure');
		} finally {
			LogEntry.removeHook('beforeCreate', 'break-log');
		}
		expect(await generation(target.id)).toBe(before);

		await endSessionsOf(me, target.id, new Date());
		expect(await generation(target.id)).toBe(before + 1);
		const logged = await LogEntry.count({
			where: { action: 'end-sessions', subjectId: target.id }
		});
		expect(logged).toBe(1);
	});
});
