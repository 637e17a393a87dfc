import { error } from '@sveltejs/kit';
import { listMail, outboxDir } from '$lib/server/mail/outbox';
import type { PageServerLoad } from './$types';

// Local development only: exists only while the fake mail server is configured.
export const load: PageServerLoad = async ({ url }) => {
	if (!outboxDir()) error(404, 'There is no local outbox here.');
	const to = url.searchParams.get('to') ?? '';
	const mails = await listMail(to || undefined);
	return {
		to,
		mails: mails.map(({ id, receivedAt, to, subject }) => ({ id, receivedAt, to, subject }))
	};
};
