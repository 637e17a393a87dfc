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

	it('treats a suspended account as signed out and says so', async () => {
		const u = await makeUser({ role: 'admin' });
		await models().User.update({ suspendedAt: new Date() }, { where: { id: u.id } });
		expect(await loadCurrentUser(u.id)).toEqual({ user: null, suspended: true });
	});

	it('a session for a deleted or unknown account is no session', async () => {
		expect(await loadCurrentUser('00000000-0000-4000-8000-000000000000')).toEqual({
			user: null,
			suspended: false
		});
		expect(await loadCurrentUser(null)).toEqual({ user: null, suspended: false });
	});
});
