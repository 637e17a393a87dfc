// Main-jet corrections for a change of air.
import { airAt, type AirConditions } from './air';
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

/**
 * The jet that holds the mixture from one place's air to another's, on the dry air the engine
 * burns. The metering relation (Heywood 1988, §7.2) puts fuel flow ∝ A_jet·√(ρ_fuel·Δp) and the
 * venturi's air flow ∝ A_throat·√(ρ·Δp), with ρ the density of the moist air that flows. Only the
 * dry-air part of that flow carries oxygen: dry-air flow = air flow · ρ_dry/ρ. So
 *   fuel / dry air ∝ A_jet·√ρ_fuel / (A_throat·√ρ · ρ_dry/ρ) = A_jet·√ρ_fuel·√ρ / (A_throat·ρ_dry),
 * and holding it needs A_jet ∝ ρ_dry/√ρ. In dry air (ρ_dry = ρ) that is the familiar √ρ; humid air
 * asks for a leaner jet than its total density alone says. A diameter-numbered size follows the
 * square root of the area, a flow-numbered size the area itself.
 */
export function retargetJetForAir(
	jetSize: number,
	from: AirConditions,
	to: AirConditions,
	numbering: JetNumbering = 'diameter'
): number {
	positive('jetSize', jetSize);
	checkNumbering(numbering);
	const a = airAt(from);
	const b = airAt(to);
	const area =
		b.dryDensityKgM3 / Math.sqrt(b.densityKgM3) / (a.dryDensityKgM3 / Math.sqrt(a.densityKgM3));
	return jetSize * (numbering === 'diameter' ? Math.sqrt(area) : area);
}

/** ISA sea level: 15 °C, 1013.25 hPa, dry air (1.225 kg/m³). */
const ISA_SEA_LEVEL: AirConditions = { elevationM: 0, tempC: 15, relativeHumidity: 0 };

/** The jet moved to ISA sea level, so builds tuned at different places compare. */
export function seaLevelEquivalentJet(
	jetSize: number,
	conditions: AirConditions,
	numbering: JetNumbering = 'diameter'
): number {
	return retargetJetForAir(jetSize, conditions, ISA_SEA_LEVEL, numbering);
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

/**
 * The real jet nearest an exact size on the rider's own ladder currentJet + k·step (k whole),
 * never a multiple of the step from zero: a rider with an 85 and a step of 2 owns 83, 85, 87….
 * An exact tie goes to the richer (larger) jet; a ladder that would reach 0 stops at its lowest
 * positive rung.
 */
export function jetOnLadder(
	currentJet: number,
	exactSize: number,
	step: number
): { size: number; steps: number } {
	positive('currentJet', currentJet);
	positive('exactSize', exactSize);
	positive('step', step);
	const k = (exactSize - currentJet) / step;
	// A relative epsilon so a tie computed as 0.49999… still counts as the tie it is.
	let steps = Math.floor(k + 0.5 + 1e-9 * Math.max(1, Math.abs(k)));
	while (currentJet + steps * step <= 0) steps += 1;
	const size = Number((currentJet + steps * step).toPrecision(12)); // drops float dust
	return { size, steps };
}
