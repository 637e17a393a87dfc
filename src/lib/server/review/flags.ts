import { UniqueConstraintError } from 'sequelize';
import { FLAGGED_WARNINGS, matchRules } from '../../review/rules';
import { deriveSetup, setupWarnings } from '../../sheet/derive';
import { models } from '../db/models';
import { openCase, refreshCaution } from './cases';
import type { ItemRef } from './items';

export type Signal = { code: string; detail: string };

/**
 * Raises automatic flags on an item. A flag already open for the same rule is left alone (the
 * database's unique key keeps one), so scanning again after every save is safe.
 */
export async function raiseFlags(
	ref: ItemRef,
	authorId: string | null,
	signals: Signal[],
	now: Date
): Promise<number> {
	let raised = 0;
	for (const s of signals) {
		try {
			await models().Flag.create({
				itemType: ref.type,
				itemId: ref.id,
				code: s.code,
				detail: s.detail.slice(0, 500),
				createdAt: now
			});
			raised++;
		} catch (e) {
			if (!(e instanceof UniqueConstraintError)) throw e;
		}
	}
	if (raised) {
		await openCase(ref, authorId, now);
		await refreshCaution(ref);
	}
	return raised;
}

/** Text rules over a piece of writing. */
export async function scanText(ref: ItemRef, authorId: string | null, text: string, now: Date) {
	const signals = matchRules(text).map((m) => ({
		code: `text:${m.code}`,
		detail: `${m.label}: “…${m.excerpt}…”`
	}));
	return raiseFlags(ref, authorId, signals, now);
}

/**
 * Everything automatic about a published build: its story, each setup's note, and the tuning
 * warnings of each setup with its best run. Drafts are nobody's business but their builder's.
 */
export async function scanBuild(buildId: number, now: Date = new Date()): Promise<void> {
	const b = await models().Build.findByPk(buildId);
	if (!b || b.publication !== 'published') return;
	await scanText({ type: 'build', id: b.id }, b.ownerId, `${b.title}\n${b.story}`, now);
	const { Setup, Run } = models();
	const [setupRows, runRows] = await Promise.all([
		Setup.findAll({ where: { buildId: b.id }, order: [['position', 'ASC']] }),
		Run.findAll({ where: { buildId: b.id }, order: [['id', 'ASC']] })
	]);
	for (const s of setupRows) {
		const ref: ItemRef = { type: 'setup', id: s.id };
		await scanText(ref, b.ownerId, s.changeNote, now);
		const best = runRows
			.filter((r) => r.setupId === s.id)
			.reduce<(typeof runRows)[number] | null>(
				(m, r) => (!m || r.speedKmh > m.speedKmh ? r : m),
				null
			);
		const warnings = setupWarnings(
			deriveSetup(s.config),
			best ? { speedKmh: best.speedKmh, chtFullC: best.chtFullC, chtSensor: best.chtSensor } : null,
			b.stockSpeedKmh,
			b.brakesUpgraded
		).filter((w) => FLAGGED_WARNINGS.includes(w.code));
		await raiseFlags(
			ref,
			b.ownerId,
			warnings.map((w) => ({ code: `tuning:${w.code}`, detail: w.message })),
			now
		);
	}
}
