import { idParam, readBuild } from '$lib/server/sheets/access';
import { unitsFor } from '$lib/server/sheets/units';
import { buildView } from '$lib/server/sheets/view';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { build, canEdit } = await readBuild(event, idParam(event.params.id));
	const units = unitsFor(event);
	return { units, canEdit, ...(await buildView(build, units)) };
};
