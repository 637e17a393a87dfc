import { error } from '@sveltejs/kit';
import { listMail, outboxDir } from '$lib/server/mail/outbox';
import type { PageServerLoad } from './$types';

// Local development only: exists only while the fake mail server is configured.
export const load: PageServerLoad = async ({ url, setHeaders }) => {
	if (!outboxDir()) error(404, 'There is no local outbox here.');
	// Read from the mail server's folder, not the database: never kept by any cache.
	setHeaders({ 'cache-control': 'no-store' });
	const to = url.searchParams.get('to') ?? '';
	const mails = await listMail(to || undefined);
	return {
		to,
		mails: mails.map(({ id, receivedAt, to, subject }) => ({ id, receivedAt, to, subject }))
	};
};
