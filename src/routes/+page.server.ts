import { listBuilds } from '$lib/server/search/build-list';
import { unitsFor } from '$lib/server/sheet/units';
import { newestSteps } from '$lib/server/stats/change-effects';
import { buildListSchema } from '$lib/schemas/build-list';
import type { PageServerLoad } from './$types';

// Public: the community at a glance — the latest published sheets and the newest steps that count
// in change effects. Two queries for the list (ids, then details) and one for the steps.
export const load: PageServerLoad = async (event) => {
	const units = unitsFor(event);
	const [latest, steps] = await Promise.all([
		listBuilds(buildListSchema.parse({ sort: 'newest', limit: 6 }), units),
		newestSteps(6)
	]);
	return { units, latest: latest.builds, steps };
};
