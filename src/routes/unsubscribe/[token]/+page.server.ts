import { fail } from '@sveltejs/kit';
import { unsubscribe } from '$lib/server/accounts/mail-choices';
import { TOPICS, readUnsubscribe } from '$lib/server/mail/unsubscribe';
import type { Actions, PageServerLoad } from './$types';

// No sign-in: the signed link is the permission, so it works from any mail client. Reading the
// page changes nothing (mail scanners open links); the one button does.

export const load: PageServerLoad = async ({ params }) => {
	const t = readUnsubscribe(params.token);
	return { valid: t !== null, topic: t ? TOPICS[t.topic].label : null };
};

export const actions: Actions = {
	default: async ({ params }) => {
		const t = readUnsubscribe(params.token);
		if (!t) return fail(400, { done: false });
		await unsubscribe(t.userId, t.topic);
		return { done: true };
	}
};
