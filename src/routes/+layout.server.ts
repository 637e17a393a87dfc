import { roleAllows } from '$lib/roles';
import { outboxDir } from '$lib/server/mail/outbox';
import { models } from '$lib/server/db/models';
import type { LayoutServerLoad } from './$types';

export const load: LayoutServerLoad = async ({ locals }) => {
	const user = locals.user;
	// Shop accounts always get the shop desk; other accounts once they joined a shop's staff.
	const shopDesk = user
		? roleAllows(user.role, 'shop') ||
			(await models().ShopStaff.count({ where: { userId: user.id } })) > 0
		: false;
	return {
		user,
		suspension: user?.suspension ?? null,
		outbox: outboxDir() !== null,
		shopDesk
	};
};
