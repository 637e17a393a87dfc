import { BUILD_FIELDS } from '../../sheet/fields';
import { SETUP_FIELDS, STOCK_BASELINE_FIELDS } from '../../sheet/setup-fields';
import { RUN_FIELDS } from '../../sheet/run-fields';
import { missingFor, roundStored } from '../../sheet/schema';
import * as builds from './builds';
import type { Build, Run } from '../db/models';
import type { SetupConfig } from '../db/models/setup';
import * as parts from './parts';
import * as runs from './runs';
import * as setups from './setups';
import { ApiFailure } from '../../failure';
import { recomputeBuild, recomputeSetup, refreshListing } from '../derived/recompute';

// The build-sheet rules shared by the form actions (and, later, the JSON API).

type Stored = Record<string, string | number | boolean | null>;

export async function saveSetup(
	buildId: number,
	stored: Stored,
	existing?: { id: number; version: number }
) {
	// Every door (forms, JSON, import, demo data) passes here: numbers are kept at field precision.
	const { changeNote, isStock, ...config } = roundStored(SETUP_FIELDS, stored);
	const note = String(changeNote ?? '');
	let id = existing?.id;
	if (existing) {
		if (
			!(await setups.update(existing.id, existing.version, {
				changeNote: note,
				isStock: Boolean(isStock),
				config: config as SetupConfig
			}))
		)
			return { conflict: true as const };
	} else {
		id = (await setups.create(buildId, note, Boolean(isStock), config as SetupConfig)).id;
	}
	await recomputeSetup(id!);
	await recomputeBuild(buildId);
	return { id: id! };
}

/** A new setup starts as a copy of the latest one, with an empty "what changed". */
export async function newSetupValues(buildId: number): Promise<Stored> {
	const last = await setups.latest(buildId);
	if (!last)
		return {
			changeNote: 'Stock baseline',
			isStock: true,
			// A stock baseline's exhaust is stock by definition; nothing else is guessed.
			exhaustType: 'stock'
		};
	return { ...last.config, changeNote: '', isStock: false };
}

const RUN_COLUMNS: Record<string, keyof Run> = {
	speed: 'speedKmh',
	elevation: 'elevationM',
	temp: 'tempC',
	humidity: 'humidityPct',
	pressure: 'pressureKpa',
	chtCruise: 'chtCruiseC',
	chtFull: 'chtFullC',
	riderMass: 'riderMassKg',
	accelTarget: 'accelTargetKmh'
};

export function runToColumns(stored: Stored): runs.RunValues {
	const out: Record<string, unknown> = {};
	for (const [k, v] of Object.entries(stored))
		out[RUN_COLUMNS[k] ?? k] =
			k === 'notes' ? (v ?? '') : k === 'plugReading' && v === '' ? null : v;
	return out as runs.RunValues;
}

export function runFromColumns(r: Run): Stored {
	const back = Object.fromEntries(Object.entries(RUN_COLUMNS).map(([form, col]) => [col, form]));
	const out: Stored = {};
	for (const [k, v] of Object.entries(r.get({ plain: true })))
		out[back[k] ?? k] = v as Stored[string];
	return out;
}

export async function saveRun(
	buildId: number,
	setupId: number,
	stored: Stored,
	existing?: { id: number; version: number }
) {
	const values = runToColumns(roundStored(RUN_FIELDS, stored));
	let id = existing?.id;
	if (existing) {
		if (!(await runs.update(existing.id, existing.version, { ...values, setupId } as never)))
			return { conflict: true as const };
	} else id = (await runs.create(buildId, setupId, values)).id;
	await recomputeSetup(setupId);
	await recomputeBuild(buildId);
	return { id: id! };
}

/**
 * A part or photo may name the setup it was fitted in: only one of the same build's setups.
 * Anything else (missing, another member's draft) is refused with the field named.
 */
export async function checkSetupOf(buildId: number, setupId: number | null): Promise<void> {
	if (setupId === null) return;
	const ok = Number.isInteger(setupId) && (await setups.read(buildId, setupId)) !== null;
	if (!ok) {
		const message = 'Choose one of this build’s setups (or none).';
		throw new ApiFailure(422, message, [{ path: 'setupId', message }]);
	}
}

const partValues = (stored: Stored): parts.PartValues => ({
	category: String(stored.category),
	name: String(stored.name),
	costMinor: Math.round(Number(stored.cost ?? 0) * 100),
	link: stored.link ? String(stored.link) : null,
	setupId: stored.setupId ? Number(stored.setupId) : null
});

/** A part's values as its form shows them (cost in the currency's units, setup as a choice). */
export function partToStored(p: parts.PartValues): Stored {
	return {
		category: p.category,
		name: p.name,
		cost: p.costMinor / 100,
		link: p.link ?? '',
		setupId: p.setupId === null ? '' : String(p.setupId)
	};
}

export async function addPart(buildId: number, stored: Stored) {
	await checkSetupOf(buildId, stored.setupId ? Number(stored.setupId) : null);
	await parts.create(buildId, partValues(stored));
	await recomputeBuild(buildId);
}

/** Changes a listed part; false when it is not (or no longer) on this build. */
export async function updatePart(buildId: number, partId: number, stored: Stored) {
	await checkSetupOf(buildId, stored.setupId ? Number(stored.setupId) : null);
	if (!(await parts.update(buildId, partId, partValues(stored)))) return false;
	await recomputeBuild(buildId);
	return true;
}

export async function removePart(buildId: number, partId: number) {
	await parts.destroy(buildId, partId);
	await recomputeBuild(buildId);
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

export async function setPublication(b: Build, state: 'draft' | 'published') {
	const ok = await builds.update(b.id, b.version, {
		publication: state,
		publishedAt: state === 'published' ? (b.publishedAt ?? new Date()) : b.publishedAt
	});
	await refreshListing(b.id);
	return ok;
}
