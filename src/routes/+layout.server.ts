import { env } from '$lib/server/env';
import type { LayoutServerLoad } from './$types';

export const load: LayoutServerLoad = async ({ locals }) => ({
	user: locals.user,
	suspension: locals.user?.suspension ?? null,
	outbox: Boolean(env().FAKE_MAIL_DIR)
});
