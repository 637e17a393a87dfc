import { error } from '@sveltejs/kit';
import { linksIn, outboxDir, readMail } from '$lib/server/mail/outbox';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params, setHeaders }) => {
	if (!outboxDir()) error(404, 'There is no local outbox here.');
	setHeaders({ 'cache-control': 'no-store' });
	const mail = await readMail(params.id);
	if (!mail) error(404, 'No such mail in the outbox.');
	return { mail: { ...mail, html: undefined }, links: linksIn(mail.text) };
};
