import { median } from 'simple-statistics';

// The figures on a shop page, from the builds it is named on. Pure, so it is tested on its own.

export type LinkedBuild = {
	id: number;
	title: string;
	kind: 'built' | 'tuned';
	cc: number | null;
	bestKmh: number | null;
	partsMinor: number;
	currency: string;
};

/** Displacement classes, by the representative setup's cc; each takes what is above the last. */
export const CC_CLASSES = [
	{ label: 'up to 50 cc', max: 50 },
	{ label: '51–70 cc', max: 70 },
	{ label: '71–90 cc', max: 90 },
	{ label: 'over 90 cc', max: Infinity }
] as const;

export type ShopSummary = {
	builds: number;
	speedByClass: { label: string; builds: number; medianKmh: number }[];
	costByCurrency: { currency: string; builds: number; medianMinor: number }[];
};

/**
 * Number of builds; median best measured speed per displacement class (builds without a measured
 * run left out); median parts cost per currency (builds with no costed parts left out). Classes
 * and currencies with no build are not listed.
 */
export function summarise(builds: LinkedBuild[]): ShopSummary {
	const speedByClass = CC_CLASSES.map((c, i) => {
		const min = i === 0 ? -Infinity : CC_CLASSES[i - 1].max;
		const speeds = builds
			.filter((b) => b.cc !== null && b.cc > min && b.cc <= c.max)
			.map((b) => b.bestKmh)
			.filter((v): v is number => v !== null);
		return { label: c.label, builds: speeds.length, medianKmh: speeds.length ? median(speeds) : 0 };
	}).filter((c) => c.builds > 0);
	const currencies = [...new Set(builds.map((b) => b.currency))].sort();
	const costByCurrency = currencies
		.map((currency) => {
			const costs = builds
				.filter((b) => b.currency === currency && b.partsMinor > 0)
				.map((b) => b.partsMinor);
			return {
				currency,
				builds: costs.length,
				medianMinor: costs.length ? Math.round(median(costs)) : 0
			};
		})
		.filter((c) => c.builds > 0);
	return { builds: builds.length, speedByClass, costByCurrency };
}
