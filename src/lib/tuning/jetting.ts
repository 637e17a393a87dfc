// Main-jet corrections for a change of air.
import { airAt, ISA_SEA_LEVEL_DENSITY, type AirConditions } from './air';
import { between, positive } from './check';

/** How a jet series is numbered: by orifice diameter (e.g. hundredths of a mm) or by flow. */
export type JetNumbering = 'diameter' | 'flow';

const FT_1000_M = 304.8;

function checkNumbering(n: JetNumbering) {
	if (n !== 'diameter' && n !== 'flow')
		throw new RangeError(`numbering must be 'diameter' or 'flow' (got ${String(n)})`);
}

/**
 * The jet that keeps the mixture when air density changes. The carburettor metering relation
 * (Heywood, ICE Fundamentals 1988, §7.2: fuel/air ∝ A_jet/A_throat · √(ρ_fuel/ρ_air)) needs jet
 * area ∝ √ρ_air to hold fuel/air, so diameter-numbered size ∝ ρ^¼ and flow-numbered size ∝ ρ^½.
 */
export function retargetJet(
	jetSize: number,
	fromDensity: number,
	toDensity: number,
	numbering: JetNumbering = 'diameter'
): number {
	positive('jetSize', jetSize);
	between('fromDensity', fromDensity, 0.05, 2);
	between('toDensity', toDensity, 0.05, 2);
	checkNumbering(numbering);
	const exponent = numbering === 'diameter' ? 0.25 : 0.5;
	return jetSize * Math.pow(toDensity / fromDensity, exponent);
}

/** The jet moved to ISA sea level (1.225 kg/m³), so builds tuned at different places compare. */
export function seaLevelEquivalentJet(
	jetSize: number,
	conditions: AirConditions,
	numbering: JetNumbering = 'diameter'
): number {
	positive('jetSize', jetSize);
	checkNumbering(numbering);
	return retargetJet(jetSize, airAt(conditions).densityKgM3, ISA_SEA_LEVEL_DENSITY, numbering);
}

/**
 * The trade rule: one jet step per 1,000 ft, leaner going up and richer going down, as a
 * continuous value. Common practice, no published source.
 */
export function ruleOfThumbJet(
	jetSize: number,
	fromElevationM: number,
	toElevationM: number,
	stepSize: number
): number {
	positive('jetSize', jetSize);
	between('fromElevationM', fromElevationM, -500, 11000);
	between('toElevationM', toElevationM, -500, 11000);
	positive('stepSize', stepSize);
	const size = jetSize - (stepSize * (toElevationM - fromElevationM)) / FT_1000_M;
	if (size <= 0)
		throw new RangeError(
			`toElevationM is so far above the start that the rule leaves no jet (${size.toFixed(1)})`
		);
	return size;
}

/** The nearest real jet, a multiple of stepSize; an exact tie goes to the richer (larger) jet. */
export function nearestJet(size: number, stepSize: number): number {
	positive('size', size);
	positive('stepSize', stepSize);
	const k = size / stepSize;
	// A relative epsilon so 101.25/2.5 = 40.49999… still counts as the tie it is.
	const n = Math.floor(k + 0.5 + 1e-9 * Math.max(1, Math.abs(k)));
	// Below half a step the nearest multiple would be 0, which is no jet: give the smallest step.
	const jet = Math.max(1, n) * stepSize;
	return Number(jet.toPrecision(12)); // drops float dust such as 102.50000000000001
}
