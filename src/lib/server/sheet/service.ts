import { SETUP_FIELDS } from '../../sheet/setup-fields';
import { RUN_FIELDS } from '../../sheet/run-fields';
import { roundStored } from '../../sheet/schema';
import type { Run } from '../db/models';
import type { SetupConfig } from '../db/models/setup';
import * as parts from './parts';
import * as runs from './runs';
import * as setups from './setups';
import { Failure, fieldFailure } from '../../failure';
import { recomputeSetup } from '../derived/recompute';
import { inTransaction } from '../db/transaction';
import { forgetItems } from '../review/items';
import { sheetChanged, stale } from './changed';
import { stockBaselineFrom } from '../../scooters/prefill';
import { readScooter, unlessRefused } from '../scooters/catalogue';

// The changes to a build's setups, runs and parts: one function each, shared by the form
// actions, the JSON routes, the import and the demo data; each is one transaction.

type Stored = Record<string, string | number | boolean | null>;

/** Saves a new setup or changes one (409 when someone saved it since `existing.version`). */
export async function saveSetup(
	buildId: number,
	stored: Stored,
	existing?: { id: number; version: number }
): Promise<{ id: number }> {
	// Every door (forms, JSON, import, demo data) passes here: numbers are kept at field precision.
	const { changeNote, isStock, ...values } = roundStored(SETUP_FIELDS, stored);
	const patch = {
		changeNote: String(changeNote ?? ''),
		isStock: Boolean(isStock),
		config: values as SetupConfig
	};
	return inTransaction(async () => {
		let id = existing?.id;
		if (existing) {
			if (!(await setups.update(existing.id, existing.version, patch))) throw stale('setup');
		} else id = (await setups.create(buildId, patch.changeNote, patch.isStock, patch.config)).id;
		await recomputeSetup(id!);
		await sheetChanged(buildId);
		return { id: id! };
	});
}

/**
 * Deletes a setup with its runs (the foreign key takes them), and the review desk's reports,
 * flags and cases about it; parts and photos it named stay on the build, tied to no setup.
 */
export async function removeSetup(buildId: number, setupId: number): Promise<void> {
	await inTransaction(async () => {
		await forgetItems([{ type: 'setup', id: setupId }]);
		await setups.destroy(setupId);
		await sheetChanged(buildId);
	});
}

/** A new setup starts as a copy of the latest one, with an empty "what changed". */
export async function newSetupValues(build: {
	id: number;
	ownerId: string | null;
	baseScooterId: number | null;
}): Promise<Stored> {
	const last = await setups.latest(build.id);
	if (!last && build.baseScooterId !== null) {
		// The stock baseline as the factory fitted the scooter the build starts from.
		const owner = build.ownerId ? { id: build.ownerId, role: 'member' as const } : null;
		const s = await unlessRefused(readScooter(build.baseScooterId, owner));
		if (s) return stockBaselineFrom(s) as Stored;
	}
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

/**
 * What a new run starts from: the build's latest run's place, air, measuring method and
 * rider-plus-kit mass — the things that stay the same from one run to the next at the track —
 * never its speed or date. Empty for a build with no run yet.
 */
export const CARRIED_RUN_FIELDS = [
	'venue',
	'elevation',
	'temp',
	'humidity',
	'pressure',
	'pressureKind',
	'method',
	'riderMass'
] as const;

export async function carriedRunValues(
	buildId: number
): Promise<{ values: Stored; from: { runOn: string } | null }> {
	const last = await runs.latestForBuild(buildId);
	if (!last) return { values: {}, from: null };
	const stored = runFromColumns(last);
	const values: Stored = {};
	for (const k of CARRIED_RUN_FIELDS)
		if (stored[k] !== null && stored[k] !== undefined) values[k] = stored[k];
	return { values, from: { runOn: String(last.runOn).slice(0, 10) } };
}

export async function saveRun(
	buildId: number,
	setupId: number,
	stored: Stored,
	existing?: { id: number; version: number }
): Promise<{ id: number }> {
	const values = runToColumns(roundStored(RUN_FIELDS, stored));
	return inTransaction(async () => {
		let id = existing?.id;
		if (existing) {
			if (!(await runs.update(existing.id, existing.version, { ...values, setupId } as never)))
				throw stale('run');
		} else id = (await runs.create(buildId, setupId, values)).id;
		await recomputeSetup(setupId);
		await sheetChanged(buildId);
		return { id: id! };
	});
}

export async function removeRun(buildId: number, run: { id: number; setupId: number }) {
	await inTransaction(async () => {
		await runs.destroy(run.id);
		await recomputeSetup(run.setupId);
		await sheetChanged(buildId);
	});
}

/**
 * A part or photo may name the setup it was fitted in: only one of the same build's setups.
 * Anything else (missing, another member's draft) is refused with the field named.
 */
export async function checkSetupOf(buildId: number, setupId: number | null): Promise<void> {
	if (setupId === null) return;
	const ok = Number.isInteger(setupId) && (await setups.read(buildId, setupId)) !== null;
	if (!ok) {
		throw fieldFailure(422, 'setupId', 'Choose one of this build’s setups (or none).');
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

export async function addPart(buildId: number, stored: Stored): Promise<{ id: number }> {
	return inTransaction(async () => {
		await checkSetupOf(buildId, stored.setupId ? Number(stored.setupId) : null);
		const p = await parts.create(buildId, partValues(stored));
		await sheetChanged(buildId);
		return { id: p.id };
	});
}

/** Changes a listed part; 404 when it is not (or no longer) on this build. */
export async function updatePart(buildId: number, partId: number, stored: Stored): Promise<void> {
	await inTransaction(async () => {
		await checkSetupOf(buildId, stored.setupId ? Number(stored.setupId) : null);
		if (!(await parts.update(buildId, partId, partValues(stored))))
			throw new Failure(404, 'That part is no longer on this build.');
		await sheetChanged(buildId);
	});
}

export async function removePart(buildId: number, partId: number): Promise<void> {
	await inTransaction(async () => {
		await parts.destroy(buildId, partId);
		await sheetChanged(buildId);
	});
}
