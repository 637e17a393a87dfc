import { ITEM_TYPES } from '$lib/review/kinds';
import { requireRole } from '$lib/server/guard';
import * as log from '$lib/server/review/log';
import type { PageServerLoad } from './$types';

const PAGE = 100;

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'moderator');
	const q = event.url.searchParams;
	const action = q.get('action') || undefined;
	const itemType = ITEM_TYPES.find((t) => t === q.get('itemType'));
	const itemId = itemType ? Number(q.get('itemId')) || undefined : undefined;
	const order = q.get('order') === 'oldest' ? 'oldest' : 'newest';
	// The page cursor is the last id shown: older ones when newest first, newer ones otherwise.
	const from = Number(q.get('from')) || undefined;
	const entries = await log.list({
		action,
		itemType,
		itemId,
		order,
		beforeId: order === 'newest' ? from : undefined,
		afterId: order === 'oldest' ? from : undefined,
		limit: PAGE
	});
	return {
		entries,
		filter: {
			action: action ?? '',
			itemType: itemType ?? '',
			itemId: itemId ? String(itemId) : '',
			order
		},
		next: entries.length === PAGE ? entries.at(-1)!.id : null
	};
};
