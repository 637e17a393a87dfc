import { json } from '@sveltejs/kit';
import { api } from '$lib/server/api';
import { readBuild, seesTakenDown } from '$lib/server/sheet/access';
import { exportBuild } from '$lib/server/sheet/export';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = api(async (event) => {
	const { build } = await readBuild(event, Number(event.params.id));
	return json(await exportBuild(build, { withTakenDown: seesTakenDown(event, build) }), {
		headers: { 'content-disposition': `attachment; filename="build-${build.id}.squishline.json"` }
	});
});
