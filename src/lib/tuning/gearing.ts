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

/**
 * A CVT's ratio from the belt's pitch diameters on its two pulleys: the driven pulley turns
 * drive/driven as fast as the drive pulley, so engine rpm ÷ driven rpm = D_driven / D_drive
 * (belt-drive speed ratio, no slip; Shigley's Mechanical Engineering Design, ch. 17).
 */
export function cvtRatio(drivePitchDiaMm: number, drivenPitchDiaMm: number): number {
	positive('drivePitchDiaMm', drivePitchDiaMm);
	positive('drivenPitchDiaMm', drivenPitchDiaMm);
	return drivenPitchDiaMm / drivePitchDiaMm;
}

/**
 * Pitch length of an open belt over two pulleys of pitch diameters d1, d2 at centre distance C,
 * exact: L = √(4C² − (D − d)²) + (D·θ_D + d·θ_d)/2, θ_d = π − 2·asin((D − d)/(2C)),
 * θ_D = π + 2·asin((D − d)/(2C)) — the open-belt geometry of Shigley's Mechanical Engineering
 * Design, ch. 17 (the approximate 2C + π(D + d)/2 + (D − d)²/(4C) is the series form).
 */
export function beltPitchLengthMm(d1Mm: number, d2Mm: number, centreMm: number): number {
	positive('d1Mm', d1Mm);
	positive('d2Mm', d2Mm);
	positive('centreMm', centreMm);
	const big = Math.max(d1Mm, d2Mm);
	const small = Math.min(d1Mm, d2Mm);
	if (centreMm <= (big + small) / 2)
		throw new RangeError(
			`centreMm must be more than the sum of the two radii (${(big + small) / 2} mm), got ${centreMm}`
		);
	const phi = Math.asin((big - small) / (2 * centreMm));
	return (
		Math.sqrt(4 * centreMm ** 2 - (big - small) ** 2) +
		(big * (Math.PI + 2 * phi) + small * (Math.PI - 2 * phi)) / 2
	);
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

/**
 * Top speed the gearing allows at peak rpm (drag ignored: a ceiling, not a prediction). A tyre
 * given by its marking rolls on π·D·rollingFactor, the same factor the calculators take; a
 * circumference given as a number is used as measured.
 */
export function gearingLimitedSpeedKmh(
	peakRpm: number,
	topCvtRatio: number,
	stages: readonly GearStage[],
	tyreDesignationOrCircumferenceMm: string | number,
	rollingFactor = 1
): number {
	const c =
		typeof tyreDesignationOrCircumferenceMm === 'number'
			? positive('tyreDesignationOrCircumferenceMm', tyreDesignationOrCircumferenceMm)
			: tyreCircumferenceMm(tyreDesignationOrCircumferenceMm, rollingFactor);
	positive('peakRpm', peakRpm);
	return roadSpeedKmh(peakRpm, overallReduction(topCvtRatio, stages), c);
}
