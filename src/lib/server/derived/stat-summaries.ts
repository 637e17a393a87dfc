import { QueryTypes } from 'sequelize';
import { MARK_COLUMNS, MARKED, deltaStatements } from '../../stats/summary-sql';
import { db } from '../db/connection';

const COLS = MARK_COLUMNS.join(', ');

/**
 * Brings the speed map's bins and change effects' counts up to date with one build's setups:
 * takes away what the build added last time (its rows in stat_marks), adds what it holds now.
 * Called at the end of every listing refresh, inside the change's transaction, so the summaries
 * commit or roll back with it.
 *
 * Bins keep the lowest and highest x they have seen (where the trend line starts and ends); a value
 * taken away does not narrow them again until the bin empties, so after edits the line may reach a
 * little past the data, never past the bin's own edges.
 */
export async function refreshSummaries(buildId: number): Promise<void> {
	const s = db();
	const replacements = { buildId };
	// Most saves (a part, the story) change nothing the bins read: then only the version moves.
	const [before, now] = await Promise.all([
		s.query(`SELECT ${COLS} FROM stat_marks WHERE build_id = :buildId ORDER BY id`, {
			replacements,
			type: QueryTypes.SELECT
		}),
		s.query(`SELECT ${COLS} FROM setups WHERE build_id = :buildId AND (${MARKED}) ORDER BY id`, {
			replacements,
			type: QueryTypes.SELECT
		})
	]);
	// Every listing refresh moves the version on (a title shows on the speed map's points too),
	// so answers kept under the old one are read afresh (stats/kept.ts).
	await s.query('UPDATE summary_version SET v = v + 1 WHERE id = 1');
	if (JSON.stringify(before) === JSON.stringify(now)) return;
	for (const sql of deltaStatements()) await s.query(sql, { replacements });
}
