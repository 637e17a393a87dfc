import type { CloseQuery } from '../../schemas/close';
import { closeBuilds, targetFrom, targetFromBuild, wouldGet } from './service';

/** The close-builds answer for a query: shared by GET /api/builds/close and the page's first render. */
export async function searchClose(q: CloseQuery) {
	let target = targetFrom(q);
	let cycle: string = q.cycle;
	let from: number | null = null;
	if (q.build) {
		const b = await targetFromBuild(q.build);
		if (b) {
			target = b.target;
			cycle = b.cycle;
			from = q.build;
		}
	}
	const found = await closeBuilds(target, {
		cycle,
		all: q.all === '1',
		limit: q.limit,
		excludeBuild: from ?? undefined
	});
	return { ...found, target, fromBuild: from, wouldGet: wouldGet(q, target, found.results) };
}

export type CloseAnswer = Awaited<ReturnType<typeof searchClose>>;
