import type { Handle, HandleServerError } from '@sveltejs/kit';
import { sequence } from '@sveltejs/kit/hooks';
import { authHandle } from '$lib/server/auth';
import { loadCurrentUser } from '$lib/server/auth/current-user';

const currentUser: Handle = async ({ event, resolve }) => {
	const session = await event.locals.auth();
	const loaded = await loadCurrentUser(session?.user?.id);
	event.locals.user = loaded.user;
	event.locals.suspended = loaded.suspended;
	return resolve(event);
};

export const handle = sequence(authHandle, currentUser);

export const handleError: HandleServerError = ({ error, event, status }) => {
	if (status !== 404) console.error(`[${event.request.method} ${event.url.pathname}]`, error);
	return { message: status === 404 ? 'Not found.' : 'Something went wrong on our side.' };
};
