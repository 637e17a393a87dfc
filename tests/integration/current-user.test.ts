import { afterAll, describe, expect, it } from 'vitest';
import { loadCurrentUser } from '../../src/lib/server/auth/current-user';
import { closeDb } from '../../src/lib/server/db/connection';
import { models } from '../../src/lib/server/db/models';
import { makeUser } from '../support/factories';

afterAll(closeDb);

// hooks.server.ts calls loadCurrentUser on every request with the session's user id; these show
// a change written straight to the table is seen by the very next call.
describe('current user, read fresh on every request', () => {
	it('sees a role change at once', async () => {
		const u = await makeUser();
		expect((await loadCurrentUser(u.id)).user?.role).toBe('member');
		await models().User.update({ role: 'moderator' }, { where: { id: u.id } });
		expect((await loadCurrentUser(u.id)).user?.role).toBe('moderator');
		await models().User.update({ role: 'member' }, { where: { id: u.id } });
		expect((await loadCurrentUser(u.id)).user?.role).toBe('member');
	});

	it('keeps a suspended member signed in, read-only, until the end of the period', async () => {
		const u = await makeUser({ role: 'admin' });
		const now = new Date('2026-12-02T10:00:00Z');
		const until = new Date('2026-12-09T10:00:00Z');
		await models().User.update(
			{ suspendedAt: now, suspendedUntil: until, suspendedReason: 'spam' },
			{ where: { id: u.id } }
		);
		expect((await loadCurrentUser(u.id, now)).user?.suspension).toEqual({
			reason: 'spam',
			until: until.toISOString()
		});
		// One millisecond before the end it still holds; at the end it is gone without anyone lifting it.
		expect(
			(await loadCurrentUser(u.id, new Date(until.getTime() - 1))).user?.suspension
		).not.toBeNull();
		expect((await loadCurrentUser(u.id, until)).user?.suspension).toBeNull();
	});

	it('a suspension without an end lasts until lifted', async () => {
		const u = await makeUser();
		await models().User.update({ suspendedAt: new Date() }, { where: { id: u.id } });
		const far = new Date('2099-01-01T00:00:00Z');
		expect((await loadCurrentUser(u.id, far)).user?.suspension?.until).toBeNull();
	});

	it('a session for a deleted or unknown account is no session', async () => {
		expect(await loadCurrentUser('00000000-0000-4000-8000-000000000000')).toEqual({ user: null });
		expect(await loadCurrentUser(null)).toEqual({ user: null });
	});
});
