import type { Handle, HandleServerError, ServerInit } from '@sveltejs/kit';
import { sequence } from '@sveltejs/kit/hooks';
import { authHandle } from '$lib/server/auth';
import { loadCurrentUser } from '$lib/server/auth/current-user';
import { flushCommentDigests } from '$lib/server/comment-digest';

const currentUser: Handle = async ({ event, resolve }) => {
	const session = await event.locals.auth();
	const loaded = await loadCurrentUser(session?.user?.id);
	event.locals.user = loaded.user;
	return resolve(event);
};

export const handle = sequence(authHandle, currentUser);

export const handleError: HandleServerError = ({ error, event, status }) => {
	if (status !== 404) console.error(`[${event.request.method} ${event.url.pathname}]`, error);
	return { message: status === 404 ? 'Not found.' : 'Something went wrong on our side.' };
};

/** Comment digests go out from the server process itself: a sweep each minute (see comment-digest.ts). */
export const init: ServerInit = () => {
	const timer = setInterval(() => {
		flushCommentDigests(new Date()).catch((e: unknown) => console.error('[comment digest]', e));
	}, 60_000);
	timer.unref();
};
