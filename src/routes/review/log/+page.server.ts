import { requireRole } from '$lib/server/guard';
import * as log from '$lib/server/moderation/log';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'moderator');
	const q = event.url.searchParams;
	const action = q.get('action') || undefined;
	const before = Number(q.get('before')) || undefined;
	const entries = await log.list({ action, beforeId: before, limit: 100 });
	return {
		entries,
		action: action ?? '',
		next: entries.length === 100 ? entries.at(-1)!.id : null
	};
};
