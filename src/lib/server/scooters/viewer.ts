import type { RequestEvent } from '@sveltejs/kit';
import type { Viewer } from './catalogue';

/** Who reads the catalogue: the signed-in member (their proposals, a moderator's view) or nobody. */
export const viewerOf = (event: RequestEvent): Viewer =>
	event.locals.user ? { id: event.locals.user.id, role: event.locals.user.role } : null;
