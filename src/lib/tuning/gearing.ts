// Gearing and road speed for CVT scooters.
import { positive } from './check';
import { tyreCircumferenceMm } from './tyres';

export type GearStage = readonly [driverTeeth: number, drivenTeeth: number];

/** Product of driven/driver over the stages, clutch bell to wheel; no stages is 1. */
export function finalDriveRatio(stages: readonly GearStage[]): number {
	if (!Array.isArray(stages))
		throw new RangeError('stages must be a list of [driverTeeth, drivenTeeth] pairs');
	return stages.reduce((acc, stage, i) => {
		if (!Array.isArray(stage) || stage.length !== 2)
			throw new RangeError(`stages[${i}] must be a [driverTeeth, drivenTeeth] pair`);
		const [a, b] = stage;
		if (!Number.isInteger(a) || a <= 0)
			throw new RangeError(`stages[${i}] driver teeth must be a whole number above 0 (got ${a})`);
		if (!Number.isInteger(b) || b <= 0)
			throw new RangeError(`stages[${i}] driven teeth must be a whole number above 0 (got ${b})`);
		return acc * (b / a);
	}, 1);
}

/** Engine turns per wheel turn: CVT ratio (drive ÷ driven pulley rpm) × final drive. */
export function overallReduction(cvtRatio: number, stages: readonly GearStage[]): number {
	positive('cvtRatio', cvtRatio);
	return cvtRatio * finalDriveRatio(stages);
}

/** v = rpm · C · 60 / (10⁶ · i), C in mm, km/h. */
export function roadSpeedKmh(
	rpm: number,
	overallReduction: number,
	circumferenceMm: number
): number {
	positive('rpm', rpm);
	positive('overallReduction', overallReduction);
	positive('circumferenceMm', circumferenceMm);
	return (rpm * circumferenceMm * 60) / (1e6 * overallReduction);
}

/** The engine speed for a road speed: the inverse of roadSpeedKmh. */
export function rpmAtSpeed(kmh: number, overallReduction: number, circumferenceMm: number): number {
	positive('kmh', kmh);
	positive('overallReduction', overallReduction);
	positive('circumferenceMm', circumferenceMm);
	return (kmh * 1e6 * overallReduction) / (circumferenceMm * 60);
}

/** Top speed the gearing allows at peak rpm (drag ignored: a ceiling, not a prediction). */
export function gearingLimitedSpeedKmh(
	peakRpm: number,
	topCvtRatio: number,
	stages: readonly GearStage[],
	tyreDesignationOrCircumferenceMm: string | number
): number {
	const c =
		typeof tyreDesignationOrCircumferenceMm === 'number'
			? positive('tyreDesignationOrCircumferenceMm', tyreDesignationOrCircumferenceMm)
			: tyreCircumferenceMm(tyreDesignationOrCircumferenceMm);
	positive('peakRpm', peakRpm);
	return roadSpeedKmh(peakRpm, overallReduction(topCvtRatio, stages), c);
}
