// What a base scooter and its engine family are, as pages and the API show them, and what follows
// from the factory numbers (displacement, the stock gearing's speed limit). No database here.
import { displacementCc } from '../tuning/engine';
import { gearingLimitedSpeedKmh, type GearStage } from '../tuning/gearing';

export type EngineFamilyView = {
	id: number;
	name: string;
	engineCycle: 'two-stroke' | 'four-stroke';
	cooling: 'air' | 'liquid';
	cylinderOrientation: 'horizontal' | 'vertical';
	boreMm: number;
	strokeMm: number;
	/** π/4 · bore² · stroke, from the factory bore and stroke. */
	displacementCc: number;
};

export type BaseScooterView = {
	id: number;
	maker: string;
	model: string;
	yearFrom: number;
	yearTo: number | null;
	family: EngineFamilyView;
	carbBoreMm: number | null;
	/** Final drive, clutch bell to wheel: [driver, driven] teeth per stage. */
	finalDrive: GearStage[];
	cvtLowRatio: number | null;
	cvtTopRatio: number | null;
	rollerCount: number | null;
	rollerWeightG: number | null;
	rearTyre: string;
	restrictors: string;
	peakRpm: number | null;
	stockSpeedKmh: number | null;
	stockSpeedSource: string;
	state: 'listed' | 'proposed' | 'declined';
};

/** "Tessly Urbano 50 (2014–2020)"; a model still made runs to "now". */
export function scooterName(s: Pick<BaseScooterView, 'maker' | 'model' | 'yearFrom' | 'yearTo'>) {
	const years = s.yearTo === s.yearFrom ? `${s.yearFrom}` : `${s.yearFrom}–${s.yearTo ?? 'now'}`;
	return `${s.maker} ${s.model} (${years})`;
}

export function familyView(f: Omit<EngineFamilyView, 'displacementCc'>): EngineFamilyView {
	return { ...f, displacementCc: displacementCc(f.boreMm, f.strokeMm) };
}

/**
 * The top speed the stock gearing allows at the stock power peak, when the catalogue has what it
 * takes (top CVT ratio, every stage, tyre, peak rpm); null otherwise.
 */
export function stockGearingLimitKmh(s: BaseScooterView): number | null {
	if (!s.cvtTopRatio || !s.peakRpm || !s.rearTyre || !s.finalDrive.length) return null;
	try {
		return gearingLimitedSpeedKmh(s.peakRpm, s.cvtTopRatio, s.finalDrive, s.rearTyre);
	} catch {
		return null; // a tyre marking the tyre module cannot read
	}
}

/** "13/42 · 14/39": the final drive as the trade writes it, stage by stage. */
export const finalDriveText = (stages: GearStage[]) =>
	stages.map(([a, b]) => `${a}/${b}`).join(' · ');
