import { readerLocale } from '$lib/server/web/locale';
import { themeAttribute } from '$lib/server/web/theme';
import { type Handle, type HandleServerError, type ServerInit } from '@sveltejs/kit';
import { sequence } from '@sveltejs/kit/hooks';
import { authHandle } from '$lib/server/auth';
import { clientAddress } from '$lib/server/auth/client-address';
import { loadCurrentUser } from '$lib/server/auth/current-user';
import { forgetExpired } from '$lib/server/auth/sessions';
import { bodyLimit } from '$lib/server/web/body-limits';
import { flushCommentDigests } from '$lib/server/comments/digest';
import '$lib/server/mail/send';
import { flushMailQueue } from '$lib/server/mail/queue';
import { closeDb, warmUp } from '$lib/server/db/connection';
import { watchReplica } from '$lib/server/db/replica-watch';
import { DB_UNAVAILABLE, isDatabaseDown } from '$lib/server/db/unavailable';
import { originCheck, pinHost } from '$lib/server/web/origin-check';
import { htmlSlots } from '$lib/server/web/html-slots';
import { keptAnswers } from '$lib/server/web/kept-answers';
import { publicCache } from '$lib/server/web/public-cache';
import { changesReadPrimary, replicaReads } from '$lib/server/web/replica-reads';
import { withSecurityHeaders } from '$lib/server/web/security-headers';

// Auth.js's session cookie, whole or in chunks (a large token is split as `.0`, `.1`, …).
const SESSION_COOKIE = /^(__Secure-)?authjs\.session-token(\.\d+)?$/;

const currentUser: Handle = async ({ event, resolve }) => {
	// Without a session cookie there is no one to look up; asking Auth.js anyway makes it set a
	// callback-url cookie on every answer, and an answer with Set-Cookie cannot be shared by caches.
	const signedIn = event.cookies.getAll().some((c) => SESSION_COOKIE.test(c.name));
	const session = signedIn ? await event.locals.auth() : null;
	const loaded = await loadCurrentUser(session?.user?.id);
	event.locals.user = loaded.user;
	return resolve(event);
};

export const handle = sequence(
	withSecurityHeaders,
	originCheck,
	bodyLimit,
	pinHost,
	clientAddress,
	replicaReads,
	keptAnswers,
	authHandle,
	currentUser,
	readerLocale,
	changesReadPrimary,
	publicCache,
	themeAttribute,
	htmlSlots
);

export const handleError: HandleServerError = ({ error, event, status }) => {
	if (isDatabaseDown(error)) return { message: DB_UNAVAILABLE };
	if (status === 413) return { message: 'That is more than this page accepts. Nothing was saved.' };
	if (status !== 404) console.error(`[${event.request.method} ${event.url.pathname}]`, error);
	return { message: status === 404 ? 'Not found.' : 'Something went wrong on our side.' };
};

/** Timed work from the server process itself: comment digests, expired sessions, the mail queue. */
export const init: ServerInit = () => {
	// Sequelize asks the primary for its version before the first query of a process: ask now, so
	// a process that starts while the primary is up keeps reading from the replica should the
	// primary stop before its first request.
	warmUp().catch((e: unknown) => console.error('[database]', e));
	const stopWatch = watchReplica();
	const timer = setInterval(() => {
		const now = new Date();
		flushCommentDigests(now).catch((e: unknown) => console.error('[comment digest]', e));
		forgetExpired(now).catch((e: unknown) => console.error('[sessions]', e));
	}, 60_000);
	timer.unref();
	// The mail queue: every process sweeps, and each letter is claimed by one (mail-queue.ts).
	const mail = setInterval(() => {
		flushMailQueue(new Date()).catch((e: unknown) => console.error('[mail queue]', e));
	}, 5_000);
	mail.unref();
	// adapter-node emits this once the server has stopped taking requests (SIGTERM, SIGINT).
	process.once('sveltekit:shutdown' as never, () => {
		clearInterval(timer);
		clearInterval(mail);
		stopWatch();
		closeDb().catch(() => undefined);
	});
};
