import {
	exportSchema,
	FORMAT,
	FORMAT_VERSION,
	type BuildSheetExport
} from '../../sheet/export-schema';
import { BUILD_FIELDS } from '../../sheet/fields';
import { RUN_FIELDS } from '../../sheet/run-fields';
import { roundStored } from '../../sheet/schema';
import { SETUP_FIELDS } from '../../sheet/setup-fields';
import { parse } from '../../failure';
import type { Build } from '../db/models';
import * as parts from './parts';
import * as runs from './runs';
import * as setups from './setups';
import { env } from '../env';
import { addPart, runFromColumns, saveRun, saveSetup } from './service';
import { createBuild } from './build-service';
import { inTransaction } from '../db/transaction';

const compact = (o: Record<string, unknown>) =>
	Object.fromEntries(Object.entries(o).filter(([, v]) => v !== null && v !== undefined));
const pickFields = (names: string[], o: Record<string, unknown>) =>
	compact(Object.fromEntries(names.map((n) => [n, o[n]])));

export async function exportBuild(
	b: Build,
	opts: { withTakenDown: boolean } = { withTakenDown: true }
): Promise<BuildSheetExport> {
	const [allSetups, runRows, partRows] = await Promise.all([
		setups.listForBuild(b.id),
		runs.listForBuild(b.id),
		parts.listForBuild(b.id)
	]);
	const setupRows = opts.withTakenDown
		? allSetups
		: allSetups.filter((s) => s.moderation !== 'hidden');
	const runNames = RUN_FIELDS.map((f) => f.name);
	const index = new Map(setupRows.map((s, i) => [s.id, i]));
	const doc = {
		format: FORMAT,
		version: FORMAT_VERSION,
		exportedAt: new Date().toISOString(),
		source: new URL(`/builds/${b.id}`, env().ORIGIN).toString(),
		build: pickFields(
			BUILD_FIELDS.map((f) => f.name),
			b.get({ plain: true })
		) as BuildSheetExport['build'],
		setups: setupRows.map((s) => ({
			changeNote: s.changeNote,
			isStock: s.isStock,
			config: compact(
				roundStored(SETUP_FIELDS, s.config)
			) as BuildSheetExport['setups'][number]['config'],
			runs: runRows
				.filter((r) => r.setupId === s.id)
				.map((r) =>
					pickFields(runNames, roundStored(RUN_FIELDS, runFromColumns(r)))
				) as BuildSheetExport['setups'][number]['runs']
		})),
		parts: partRows.map((p) => ({
			category: p.category,
			name: p.name,
			costMinor: p.costMinor,
			link: p.link,
			setup: p.setupId === null ? null : (index.get(p.setupId) ?? null)
		}))
	};
	// Written in its normal form (every default spelled out), so export → import → export is stable.
	const normal = exportSchema.safeParse(doc);
	return normal.success ? normal.data : (doc as BuildSheetExport);
}

/**
 * Creates a new draft from an export document; never touches an existing build. One transaction:
 * a failure anywhere (a bad part, a lost connection) leaves nothing of it on the member's bench.
 */
export async function importBuild(ownerId: string, doc: unknown): Promise<number> {
	const sheet = parse(exportSchema, doc);
	return inTransaction(async () => {
		const b = await createBuild(ownerId, sheet.build as Record<string, never>);
		const ids: number[] = [];
		for (const s of sheet.setups) {
			const r = await saveSetup(b.id, {
				...(s.config as Record<string, never>),
				changeNote: s.changeNote,
				isStock: s.isStock
			});
			ids.push(r.id);
			for (const run of s.runs)
				await saveRun(b.id, r.id, { notes: '', ...(run as Record<string, never>) });
		}
		for (const p of sheet.parts) {
			await addPart(b.id, {
				category: p.category,
				name: p.name,
				cost: p.costMinor / 100,
				link: p.link,
				setupId: p.setup === null ? null : (ids[p.setup] ?? null)
			});
		}
		return b.id;
	});
}
