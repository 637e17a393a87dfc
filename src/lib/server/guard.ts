import { error, json, redirect, type RequestEvent } from '@sveltejs/kit';
import { suspensionMessage } from '../review/suspension';
import { roleAllows, type Role } from '../roles';
import type { CurrentUser } from './auth/current-user';

const isApi = (event: RequestEvent) => event.url.pathname.startsWith('/api/');
const READS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * The one access check for loads, actions and API handlers. Signed out: pages go to sign-in
 * (and come back), API routes answer 401. Signed in without the role: 403. A suspended member
 * passes for reading (GET) and gets 403 with the reason for anything that changes data, so no
 * route can forget the suspension.
 */
export function requireUser(
	event: RequestEvent,
	opts: { evenSuspended?: boolean } = {}
): CurrentUser {
	const user = event.locals.user;
	// evenSuspended: only for leaving (deleting one's own account), never for posting.
	if (user?.suspension && !opts.evenSuspended && !READS.has(event.request.method))
		refuse(event, 403, suspensionMessage(user.suspension));
	if (user) return user;
	if (isApi(event)) refuse(event, 401, 'Sign in first.');
	const next = event.url.pathname + event.url.search;
	redirect(303, `/signin?next=${encodeURIComponent(next)}`);
}

export function requireRole(event: RequestEvent, role: Role): CurrentUser {
	const user = requireUser(event);
	if (!roleAllows(user.role, role)) refuse(event, 403, `This needs the ${role} role.`);
	return user;
}

function refuse(event: RequestEvent, status: number, message: string): never {
	// API clients get the same { error, issues } shape as every other API failure.
	if (isApi(event)) error(status, { message, error: message, issues: [] });
	error(status, message);
}

/** JSON error body shared by the API routes. */
export function apiError(
	status: number,
	message: string,
	issues: { path: string; message: string }[] = []
) {
	return json({ error: message, issues }, { status });
}
