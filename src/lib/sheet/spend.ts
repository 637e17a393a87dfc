// The parts list in the order the build happened: grouped by the setup that fitted them, each
// step with what it cost and what its best run gave over the setup measured before it.

export type SpendSetup = {
	id: number;
	position: number;
	changeNote: string;
	best: { speedKmh: number } | null;
};
export type SpendPart = {
	id: number;
	name: string;
	category: string;
	costMinor: number;
	link: string | null;
	setupId: number | null;
};

export type SpendStep = {
	/** null: parts not tied to any setup, listed last. */
	setup: { id: number; position: number; changeNote: string } | null;
	parts: SpendPart[];
	costMinor: number;
	/** This setup's best run minus the best of the last earlier setup with a run; null if unknown. */
	gainKmh: number | null;
	/** Minor units per km/h, only for a positive gain. */
	costPerKmhMinor: number | null;
};

export function spendBySetup(setups: SpendSetup[], parts: SpendPart[]): SpendStep[] {
	const ordered = [...setups].sort((a, b) => a.position - b.position);
	const steps: SpendStep[] = [];
	let lastBest: number | null = null;
	for (const s of ordered) {
		const mine = parts.filter((p) => p.setupId === s.id);
		const gain = s.best && lastBest !== null ? s.best.speedKmh - lastBest : null;
		if (mine.length) {
			const cost = mine.reduce((n, p) => n + p.costMinor, 0);
			steps.push({
				setup: { id: s.id, position: s.position, changeNote: s.changeNote },
				parts: mine,
				costMinor: cost,
				gainKmh: gain,
				costPerKmhMinor: gain !== null && gain > 0 ? cost / gain : null
			});
		}
		if (s.best) lastBest = s.best.speedKmh;
	}
	const known = new Set(ordered.map((s) => s.id));
	const loose = parts.filter((p) => p.setupId === null || !known.has(p.setupId));
	if (loose.length)
		steps.push({
			setup: null,
			parts: loose,
			costMinor: loose.reduce((n, p) => n + p.costMinor, 0),
			gainKmh: null,
			costPerKmhMinor: null
		});
	return steps;
}
