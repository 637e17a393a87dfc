import { Failure } from '../../failure';
import { recomputeBuild } from '../derived/recompute';
import { scanBuild } from '../review/flags';

/**
 * What every change to a build sheet ends with, inside its transaction: the build's counts,
 * listing columns and steps are rewritten, and the automatic flags see the change.
 */
export async function sheetChanged(buildId: number): Promise<void> {
	await recomputeBuild(buildId);
	await scanBuild(buildId);
}

/** A save over someone else's newer save. */
export const stale = (what: 'build' | 'setup' | 'run') =>
	new Failure(409, `The ${what} changed since that version; fetch it again.`);
