import type { Role } from '../../roles';
import * as users from '../db/users';

export type CurrentUser = {
	id: string;
	email: string;
	name: string;
	role: Role;
	units: 'metric' | 'imperial';
};

export type LoadedUser = { user: CurrentUser | null; suspended: boolean };

/**
 * Reads the account behind a session id fresh from the database. Called on every request, so a
 * role change or a suspension counts from the very next request, whatever the token says.
 */
export async function loadCurrentUser(userId: string | null | undefined): Promise<LoadedUser> {
	if (!userId) return { user: null, suspended: false };
	const row = await users.read(userId);
	if (!row) return { user: null, suspended: false };
	if (row.suspendedAt) return { user: null, suspended: true };
	return {
		user: {
			id: row.id,
			email: row.email,
			name: row.name ?? row.email.split('@')[0],
			role: row.role,
			units: row.units
		},
		suspended: false
	};
}
