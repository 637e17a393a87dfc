import { BUILD_FIELDS } from '../../sheet/fields';
import { STOCK_BASELINE_FIELDS, SETUP_FIELDS } from '../../sheet/setup-fields';
import { missingFor } from '../../sheet/schema';
import { Failure } from '../../failure';
import { models, type Build } from '../db/models';
import { inTransaction } from '../db/transaction';
import { refreshSummaries } from '../derived/stat-summaries';
import { dropWords } from '../derived/search-words';
import { forgetItems } from '../review/items';
import { deleteAfterCommit } from '../storage/objects';
import { usableScooter } from '../scooters/catalogue';
import * as builds from './builds';
import { sheetChanged, stale } from './changed';
import { listPhotos } from './photos';
import * as setups from './setups';

// The changes to a build as a whole: one function each, shared by the form actions and the JSON
// routes; each is one transaction.

type Stored = Record<string, string | number | boolean | null>;

/**
 * Starts a build sheet; `baseScooterId` names the catalogue's scooter it starts from (a listed one
 * or the member's own proposal, else 422 on that field).
 */
export async function createBuild(
	ownerId: string,
	stored: Stored,
	baseScooterId: number | null = null
): Promise<Build> {
	return inTransaction(async () => {
		if (baseScooterId !== null) await usableScooter(baseScooterId, ownerId);
		const b = await builds.create(ownerId, {
			...(stored as builds.BuildPatch),
			title: String(stored.title),
			baseScooterId
		});
		await sheetChanged(b.id);
		return b;
	});
}

/** Saves the build's own fields (409 when someone saved since `version`); the new version. */
export async function saveBuild(buildId: number, version: number, stored: Stored) {
	return inTransaction(async () => {
		if (!(await builds.update(buildId, version, stored as builds.BuildPatch))) throw stale('build');
		await sheetChanged(buildId);
		return { id: buildId, version: version + 1 };
	});
}

/** What stops a build from being published, in words; empty when it may go out. */
export async function publishProblems(b: Build): Promise<string[]> {
	const problems = missingFor('build-publish', BUILD_FIELDS, b.get({ plain: true })).map(
		(l) => `Build: ${l}`
	);
	const list = await setups.listForBuild(b.id);
	if (list.length === 0) problems.push('At least one setup is needed.');
	for (const s of list) {
		const fields = s.isStock ? STOCK_BASELINE_FIELDS : SETUP_FIELDS;
		for (const l of missingFor(s.isStock ? 'stock-publish' : 'setup-publish', fields, {
			...s.config,
			changeNote: s.changeNote,
			isStock: s.isStock
		})) {
			problems.push(`Setup ${s.position} (${s.changeNote}): ${l}`);
		}
	}
	return problems;
}

/** Publishes a build, refused with its problems listed (400) while anything is missing. */
export async function publish(b: Build): Promise<void> {
	await inTransaction(async () => {
		const problems = await publishProblems(b);
		if (problems.length)
			throw new Failure(
				400,
				'Not ready to publish.',
				problems.map((message) => ({ path: '', message }))
			);
		await setPublication(b, 'published');
	});
}

/** Moves a build between draft and published as it stands (`publish` checks first). */
export async function setPublication(b: Build, state: 'draft' | 'published'): Promise<void> {
	await inTransaction(async () => {
		const ok = await builds.update(b.id, b.version, {
			publication: state,
			publishedAt: state === 'published' ? (b.publishedAt ?? new Date()) : b.publishedAt
		});
		if (!ok) throw stale('build');
		await sheetChanged(b.id);
	});
}

/**
 * Deletes a build for good: the review desk's reports, flags and cases about it, its setups and
 * its comments (those point at items by type and id, with no foreign key to cascade), then the
 * row, whose foreign keys take setups, runs, parts, photos, comments and shop links with it; its
 * photo objects leave the store once that is committed. The moderation log keeps its lines.
 */
export async function destroyBuild(buildId: number): Promise<void> {
	const { Setup, Comment, Build } = models();
	await inTransaction(async () => {
		const [setupRows, comments, photos] = await Promise.all([
			Setup.findAll({ where: { buildId }, attributes: ['id'] }),
			Comment.findAll({ where: { buildId }, attributes: ['id'] }),
			listPhotos(buildId)
		]);
		await forgetItems([
			{ type: 'build', id: buildId },
			...setupRows.map((s) => ({ type: 'setup' as const, id: s.id })),
			...comments.map((c) => ({ type: 'comment' as const, id: c.id }))
		]);
		// Its words leave the vocabulary too (the index's rows alone would go with the build).
		await dropWords(buildId);
		await Build.destroy({ where: { id: buildId } });
		// Its setups are gone: the summaries take away what they had added.
		await refreshSummaries(buildId);
		const keys = photos.flatMap((p) => [p.displayKey, p.thumbKey]);
		await deleteAfterCommit(keys);
	});
}
