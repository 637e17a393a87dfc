import { outboxDir } from '$lib/server/mail/outbox';
import { seesShopDesk } from '$lib/server/shops/pages';
import type { LayoutServerLoad } from './$types';

export const load: LayoutServerLoad = async ({ locals }) => {
	const user = locals.user;
	// Shop accounts always get the shop desk; other accounts once they joined a shop's staff.
	const shopDesk = user ? await seesShopDesk(user) : false;
	return {
		user,
		suspension: user?.suspension ?? null,
		outbox: outboxDir() !== null,
		locale: locals.locale ?? 'en-GB',
		shopDesk
	};
};
