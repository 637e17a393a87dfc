// Which kind of change a setup made, and whether a pair of consecutive setups may be used to say
// what that kind of change does. Pure: the stored columns, the change-effects page and a build's own
// page all use these rules, so they can never disagree.

export const CHANGE_KINDS = [
	{
		kind: 'exhaust',
		label: 'Exhaust',
		fields: ['exhaustType', 'powerBandFrom', 'powerBandTo', 'restrictorRemoved']
	},
	{
		kind: 'cylinder',
		label: 'Cylinder kit',
		fields: [
			'bore',
			'stroke',
			'kitMaterial',
			'chamberCc',
			'squish',
			'baseGasket',
			'headGasket',
			'compressionMeasured',
			'exhaustDuration',
			'transferDuration',
			'exhaustHeight',
			'transferHeight',
			'rod',
			'casePorted',
			'casePortingNote'
		]
	},
	{ kind: 'carburettor', label: 'Carburettor', fields: ['carbBore', 'reedType', 'airFilter'] },
	{ kind: 'main-jet', label: 'Main jet', fields: ['mainJet', 'jetNumbering'] },
	{ kind: 'needle-clip', label: 'Needle clip', fields: ['needleClip'] },
	{ kind: 'rollers', label: 'Rollers', fields: ['rollerSize', 'rollerWeights'] },
	{ kind: 'variator', label: 'Variator', fields: ['variatorType', 'topCvtRatio', 'belt'] },
	{
		kind: 'clutch-spring',
		label: 'Clutch or torque spring',
		fields: ['torqueSpring', 'clutchSprings', 'clutchEngageRpm']
	},
	{
		kind: 'final-drive',
		label: 'Final-drive gears',
		fields: ['primaryDriver', 'primaryDriven', 'secondaryDriver', 'secondaryDriven']
	},
	{ kind: 'tyre', label: 'Tyre', fields: ['rearTyre', 'tyreSpeedSymbol'] }
] as const;

export type ChangeKind = (typeof CHANGE_KINDS)[number]['kind'];
/** `mixed`: more than one kind, or a field outside every kind (ignition, fuel, pilot jet…). */
export type StepKind = ChangeKind | 'mixed' | 'none';

/** Not changes to the engine: the note, the baseline tick, and the tuner's estimate of peak rpm. */
const IGNORED = new Set(['changeNote', 'isStock', 'peakRpm']);
const KIND_OF = new Map<string, ChangeKind>(
	CHANGE_KINDS.flatMap((k) => k.fields.map((f) => [f as string, k.kind] as const))
);

export const kindLabel = (k: string) =>
	CHANGE_KINDS.find((c) => c.kind === k)?.label ??
	(k === 'mixed' ? 'Several changes at once' : k === 'none' ? 'No change' : k);

const blank = (v: unknown) => v === null || v === undefined || v === '';
function equal(a: unknown, b: unknown) {
	if (blank(a) && blank(b)) return true;
	if (typeof a === 'number' && typeof b === 'number') return Math.abs(a - b) < 1e-9;
	return a === b;
}

/** The kind of change from `prev` to `next` (their configurations). */
export function changeKind(prev: Record<string, unknown>, next: Record<string, unknown>): StepKind {
	const kinds = new Set<string>();
	for (const f of new Set([...Object.keys(prev), ...Object.keys(next)])) {
		if (IGNORED.has(f) || equal(prev[f], next[f])) continue;
		kinds.add(KIND_OF.get(f) ?? 'other');
	}
	if (kinds.size === 0) return 'none';
	if (kinds.size > 1 || kinds.has('other')) return 'mixed';
	return [...kinds][0] as ChangeKind;
}

/** The rules, as shown on the page. */
export const PAIR_RULES = {
	/** Relative difference in air density allowed between the two best runs. */
	maxDensityDiff: 0.05
};

export type StepRun = { kmh: number; method: string; density: number | null } | null;
export type Verdict =
	| { counts: true; kind: ChangeKind; deltaKmh: number }
	| { counts: false; kind: StepKind; deltaKmh: number | null; why: string };

/**
 * Whether the step from one setup to the next tells what its kind of change does: exactly one kind
 * changed, both setups have a best run, the runs used the same measuring method, and the air of the
 * two runs differs in density by at most 5 % (|ρ after / ρ before − 1| ≤ 0.05).
 */
export function judgeStep(kind: StepKind, before: StepRun, after: StepRun): Verdict {
	const deltaKmh = before && after ? Math.round((after.kmh - before.kmh) * 100) / 100 : null;
	const no = (why: string): Verdict => ({ counts: false, kind, deltaKmh, why });
	if (kind === 'none') return no('nothing changed');
	if (kind === 'mixed') return no('more than one kind of change at once');
	if (!before || !after) return no('one of the two setups has no run');
	if (before.method !== after.method) return no('measured by different methods');
	if (before.density === null || after.density === null) return no('air not recorded');
	if (Math.abs(after.density / before.density - 1) > PAIR_RULES.maxDensityDiff + 1e-12)
		return no('air density differs by more than 5 %');
	return { counts: true, kind, deltaKmh: deltaKmh! };
}
