import { deriveSetup, setupWarnings } from '../../sheet/derive';
import { diffSetups } from '../../sheet/diff';
import type { Units } from '../../sheet/units';
import { models, type Build, type Part, type Photo, type Run, type Setup } from '../db/models';
import { nestedList } from '../db/nested';
import { nameColumn } from '../auth/users';
import { renderMarkdown } from '../text/markdown';
import { signedLink } from '../storage/links';

/**
 * A build's lists as columns of one SELECT (db/nested.ts), for the build page. Replacements:
 * `buildId`, and `ownerId` for the owner's name (only the name: never the whole user row).
 */
export function sheetColumns() {
	const { Setup, Run, Part, Photo } = models();
	return {
		setups: nestedList(Setup, { alias: 's', where: 's.build_id = :buildId', order: 's.position' }),
		runs: nestedList(Run, { alias: 'r', where: 'r.build_id = :buildId', order: 'r.run_on, r.id' }),
		parts: nestedList(Part, { alias: 'p', where: 'p.build_id = :buildId', order: 'p.id' }),
		photos: nestedList(Photo, {
			alias: 'ph',
			where: 'ph.build_id = :buildId',
			order: 'ph.position'
		}),
		ownerName: nameColumn(':ownerId')
	};
}

export type SheetRows = {
	setups: Setup[];
	runs: Run[];
	parts: Part[];
	photos: Photo[];
	ownerName: string | null;
};

/** Everything the build page shows, as plain data: derived values come from the tuning module. */
export async function buildView(b: Build, units: Units, rows: SheetRows, now: Date) {
	// A published sheet's photos come straight from the store; a draft's stay behind its access rule.
	const open = b.publication === 'published' && b.moderation === 'visible';
	const photoLinks = await Promise.all(
		rows.photos.map(async (p) =>
			open
				? { display: await signedLink(p.displayKey, now), thumb: await signedLink(p.thumbKey, now) }
				: { display: `/api/photos/${p.id}/display`, thumb: `/api/photos/${p.id}/thumb` }
		)
	);
	const { setups: setupRows, runs: runRows, parts: partRows, photos: photoRows } = rows;
	const stock = b.stockSpeedKmh;
	let prev: Record<string, unknown> | null = null;
	const setupViews = setupRows.map((s) => {
		const config = s.config;
		const d = deriveSetup(config);
		const myRuns = runRows.filter((r) => r.setupId === s.id).map((r) => r.get({ plain: true }));
		const best = myRuns.reduce<(typeof myRuns)[number] | null>(
			(m, r) => (!m || r.speedKmh > m.speedKmh ? r : m),
			null
		);
		const changes = prev ? diffSetups(prev, config, units) : [];
		prev = config;
		const retune = new URLSearchParams({ units: 'metric' });
		if (typeof config.mainJet === 'number') retune.set('jet', String(config.mainJet));
		if (typeof config.jetNumbering === 'string') retune.set('numbering', config.jetNumbering);
		// The retune starts from the best run's air when it was recorded.
		if (best && best.elevationM !== null && best.tempC !== null && best.humidityPct !== null) {
			retune.set('fromElevation', String(best.elevationM));
			retune.set('fromTemp', String(best.tempC));
			retune.set('fromHumidity', String(best.humidityPct));
			if (best.pressureKpa !== null) retune.set('fromPressure', String(best.pressureKpa * 10));
			retune.set('fromPressureKind', best.pressureKind);
		}
		return {
			id: s.id,
			position: s.position,
			moderation: s.moderation,
			hiddenReason: s.hiddenReason,
			changeNote: s.changeNote,
			isStock: s.isStock,
			version: s.version,
			config,
			derived: d,
			seaLevelJet: s.seaLevelJet,
			runs: myRuns,
			best: best ? { speedKmh: best.speedKmh, method: best.method } : null,
			changes,
			warnings: setupWarnings(d, best, stock, b.brakesUpgraded),
			retuneHref: `/slide-rule/retune?${retune}`
		};
	});
	const bestSince = setupViews
		.filter((s) => !s.isStock)
		.reduce<number | null>(
			(m, s) => (s.best && (m === null || s.best.speedKmh > m) ? s.best.speedKmh : m),
			null
		);
	const gain = stock !== null && bestSince !== null ? bestSince - stock : null;
	return {
		build: {
			id: b.id,
			title: b.title,
			ownerId: b.ownerId,
			ownerName: rows.ownerName ?? (b.ownerId ? 'a member' : 'a former member'),
			storyHtml: renderMarkdown(b.story),
			chassis: b.chassis,
			engineFamily: b.engineFamily,
			engineCycle: b.engineCycle,
			cooling: b.cooling,
			cylinderOrientation: b.cylinderOrientation,
			brakeFront: b.brakeFront,
			brakeRear: b.brakeRear,
			brakesUpgraded: b.brakesUpgraded,
			currency: b.currency,
			publication: b.publication,
			moderation: b.moderation,
			hiddenReason: b.hiddenReason,
			bestSpeedKmh: b.bestSpeedKmh,
			stockSpeedKmh: stock,
			partsTotalMinor: b.partsTotalMinor,
			version: b.version
		},
		setups: setupViews,
		parts: partRows.map((p) => ({
			id: p.id,
			category: p.category,
			name: p.name,
			costMinor: p.costMinor,
			link: p.link,
			setupId: p.setupId
		})),
		photos: photoRows.map((p, i) => ({
			id: p.id,
			caption: p.caption,
			setupId: p.setupId,
			width: p.width,
			height: p.height,
			...photoLinks[i]
		})),
		costPerKmhMinor: gain !== null && gain > 0 ? b.partsTotalMinor / gain : null,
		gainKmh: gain
	};
}

export type BuildView = Awaited<ReturnType<typeof buildView>>;
