import { FLAGGED_WARNINGS, TEXT_RULES } from '$lib/review/rules';
import { requireRole } from '$lib/server/guard';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'moderator');
	return {
		rules: TEXT_RULES.map((r) => ({
			code: r.code,
			label: r.label,
			reason: r.reason,
			patterns: r.patterns.map((p) => p.source)
		})),
		warnings: [...FLAGGED_WARNINGS]
	};
};
