import { activeSuspension, type Suspension } from '../../review/suspension';
import type { Role } from '../../roles';
import type { Theme } from '../../theme';
import { replicated } from '../db/connection';
import * as users from './users';

export type CurrentUser = {
	id: string;
	email: string;
	name: string;
	role: Role;
	units: 'metric' | 'imperial';
	/** Light or dark pages, or whatever the device prefers. */
	theme: Theme;
	/** Set while suspended: the member reads but cannot change anything (see the guard). */
	suspension: Suspension | null;
};

export type LoadedUser = { user: CurrentUser | null };

/**
 * Reads the account behind a session id fresh from the database. Called on every request, so a
 * role change, a suspension or its end counts from the very next request, whatever the token says.
 */
export async function loadCurrentUser(
	userId: string | null | undefined,
	now: Date = new Date()
): Promise<LoadedUser> {
	if (!userId) return { user: null };
	// A replica a moment behind (an account made a second ago) must not sign anyone out: a "no
	// such account" from it is asked again of the primary.
	const row =
		(await users.read(userId)) ??
		(replicated() ? await users.read(userId, { fromPrimary: true }) : null);
	if (!row) return { user: null };
	return {
		user: {
			id: row.id,
			email: row.email,
			name: row.name ?? row.email.split('@')[0],
			role: row.role,
			units: row.units,
			theme: row.theme,
			suspension: activeSuspension(row, now)
		}
	};
}
