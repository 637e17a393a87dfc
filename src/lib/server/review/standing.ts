import type { CurrentUser } from '../auth/current-user';
import { roleAllows } from '../../roles';
import { cautionsFor, readCase } from './cases';

/**
 * What the build page shows about the desk: which of the build and its setups carry the caution
 * banner, and whether the author may still ask for another look at a hidden build or setup.
 */
export async function pageStanding(
	build: { id: number; ownerId: string | null; moderation: string },
	setupIds: number[],
	me: CurrentUser | null
) {
	const mine = me?.id === build.ownerId;
	const [buildCaution, setupCautions, buildCase] = await Promise.all([
		cautionsFor('build', [build.id]),
		cautionsFor('setup', setupIds),
		readCase({ type: 'build', id: build.id })
	]);
	const secondLook = async (type: 'build' | 'setup', id: number) => {
		const c = type === 'build' ? buildCase : await readCase({ type, id });
		return c?.secondLook ?? 'none';
	};
	return {
		buildCaution: buildCaution.has(build.id) && build.moderation === 'visible',
		setupCautions: [...setupCautions],
		buildSecondLook: mine ? await secondLook('build', build.id) : null,
		setupSecondLook: mine
			? Object.fromEntries(
					await Promise.all(setupIds.map(async (id) => [id, await secondLook('setup', id)]))
				)
			: {},
		seesHidden: Boolean(mine || (me && roleAllows(me.role, 'moderator')))
	};
}
