import type { CurrentUser } from '../auth/current-user';
import { roleAllows } from '../../roles';
import { parseJson, type Column } from '../db/nested';

export type CaseState = {
	caution: boolean;
	secondLook: 'none' | 'asked' | 'used';
	onDesk: boolean;
};
/** The desk's cases about one build's items, by `type:id`. */
export type Cases = Map<string, CaseState>;

const CASE_COLS = 'rc.item_type, rc.item_id, rc.caution, rc.second_look, rc.on_desk';

/**
 * The desk's cases about a build, its setups and its comments, as one column of the build page's
 * SELECT (db/nested.ts; replacement `buildId`). Three index lookups joined by UNION ALL: an OR of
 * the three would make MariaDB read every case.
 */
export const buildCasesColumn = (): Column<Cases> => ({
	sql: `(SELECT JSON_ARRAYAGG(JSON_ARRAY(t.item_type, t.item_id, t.caution, t.second_look, t.on_desk))
		FROM (
			SELECT ${CASE_COLS} FROM review_cases rc WHERE rc.item_type = 'build' AND rc.item_id = :buildId
			UNION ALL
			SELECT ${CASE_COLS} FROM setups s
				JOIN review_cases rc ON rc.item_type = 'setup' AND rc.item_id = s.id WHERE s.build_id = :buildId
			UNION ALL
			SELECT ${CASE_COLS} FROM comments cm
				JOIN review_cases rc ON rc.item_type = 'comment' AND rc.item_id = cm.id WHERE cm.build_id = :buildId
		) t)`,
	read: (value) => {
		const list = (parseJson(value) ?? []) as [
			string,
			number,
			number,
			CaseState['secondLook'],
			number
		][];
		return new Map(
			list.map(([type, id, caution, secondLook, onDesk]) => [
				`${type}:${id}`,
				{ caution: Boolean(caution), secondLook, onDesk: Boolean(onDesk) }
			])
		);
	}
});

/**
 * What the build page shows about the desk: which of the build and its setups carry the caution
 * banner, and whether the author may still ask for another look at a hidden build or setup.
 */
export function pageStanding(
	build: { id: number; ownerId: string | null; moderation: string },
	setupIds: number[],
	me: CurrentUser | null,
	cases: Cases
) {
	const mine = me?.id === build.ownerId;
	const look = (type: 'build' | 'setup', id: number) =>
		cases.get(`${type}:${id}`)?.secondLook ?? 'none';
	return {
		buildCaution:
			Boolean(cases.get(`build:${build.id}`)?.caution) && build.moderation === 'visible',
		setupCautions: setupIds.filter((id) => cases.get(`setup:${id}`)?.caution),
		buildSecondLook: mine ? look('build', build.id) : null,
		setupSecondLook: mine
			? Object.fromEntries(setupIds.map((id) => [id, look('setup', id)]))
			: ({} as Record<number, CaseState['secondLook']>),
		seesHidden: Boolean(mine || (me && roleAllows(me.role, 'moderator')))
	};
}
