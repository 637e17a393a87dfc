// Safety warnings with stable codes: the Slide rule shows them, moderation reuses the codes.
import { finite, positive } from './check';
import type { AirConditions } from './air';
import { retargetJetForAir, type JetNumbering } from './jetting';
import { speedSymbolKmh } from './tyres';
import { cToF, kmhToMph } from './units';

export type HeadTempSensor = 'plug-washer' | 'head-stud' | 'coolant';

export type SpeedWarningInput = {
	measuredKmh?: number;
	gearingLimitedKmh?: number;
	tyreSpeedSymbol?: string;
	stockKmh?: number;
	brakesUpgraded?: boolean;
	headTempC?: number;
	headTempSensor?: HeadTempSensor;
	jetChange?: {
		fromSize: number;
		toSize: number;
		from: AirConditions;
		to: AirConditions;
		numbering?: JetNumbering;
	};
	/** The reader's units: every number in a message follows them (inputs stay SI). */
	units?: 'metric' | 'imperial';
};

export type WarningCode =
	'tyre-speed-rating' | 'brakes-not-upgraded' | 'head-temperature' | 'leaner-than-physics';

export type SpeedWarning = { code: WarningCode; severity: 'caution' | 'danger'; message: string };

/**
 * Head temperature caution levels, °C. Common practice for small air-cooled two-strokes, no
 * published source; a coolant reading is a different thing and has its own level.
 */
export const HEAD_TEMP_CAUTION_C: Readonly<Record<HeadTempSensor, number>> = {
	'plug-washer': 230,
	'head-stud': 210,
	coolant: 95
};

/** A jet leaner than the physics by more than this fraction is flagged (about half a small step). */
const LEAN_TOLERANCE = 0.01;

const opt = (name: string, v: number | undefined) =>
	v === undefined ? undefined : positive(name, v);

export function speedWarnings(input: SpeedWarningInput): SpeedWarning[] {
	if (!input || typeof input !== 'object') throw new RangeError('input must be an object');
	const measured = opt('measuredKmh', input.measuredKmh);
	const geared = opt('gearingLimitedKmh', input.gearingLimitedKmh);
	const stock = opt('stockKmh', input.stockKmh);
	const imp = input.units === 'imperial';
	const speed = (kmh: number) =>
		imp ? `${Math.round(kmhToMph(kmh))} mph` : `${Math.round(kmh)} km/h`;
	const temp = (c: number) => (imp ? `${Math.round(cToF(c))} °F` : `${Math.round(c)} °C`);
	const out: SpeedWarning[] = [];
	const top = Math.max(measured ?? 0, geared ?? 0);

	if (input.tyreSpeedSymbol !== undefined && top > 0) {
		const rated = speedSymbolKmh(input.tyreSpeedSymbol);
		if (top > rated) {
			out.push({
				code: 'tyre-speed-rating',
				severity: 'danger',
				message: `${speed(top)} is above the tyre's speed symbol ${input.tyreSpeedSymbol.toUpperCase()} (${speed(rated)}). Fit tyres rated for the speed before riding this fast.`
			});
		}
	}
	const reached = measured ?? geared;
	if (
		stock !== undefined &&
		reached !== undefined &&
		reached > 1.5 * stock &&
		input.brakesUpgraded !== true
	) {
		out.push({
			code: 'brakes-not-upgraded',
			severity: 'caution',
			message: `Top speed ${speed(reached)} is over 1.5 × the stock ${speed(stock)} and no brake upgrade is recorded. Stopping distance grows with the square of speed; have the brakes checked by a licensed mechanic.`
		});
	}
	if (input.headTempC !== undefined) {
		finite('headTempC', input.headTempC);
		const sensor = input.headTempSensor ?? 'plug-washer';
		const level = HEAD_TEMP_CAUTION_C[sensor];
		if (level === undefined)
			throw new RangeError(
				`headTempSensor must be plug-washer, head-stud or coolant (got ${String(sensor)})`
			);
		if (input.headTempC > level) {
			out.push({
				code: 'head-temperature',
				severity: 'caution',
				message: `${temp(input.headTempC)} at the ${sensor} is above the usual caution level of ${temp(level)} (common practice, no published source). Check for a lean mixture or too much ignition advance before the next run.`
			});
		}
	}
	if (input.jetChange) {
		const j = input.jetChange;
		const physics = retargetJetForAir(j.fromSize, j.from, j.to, j.numbering ?? 'diameter');
		positive('jetChange.toSize', j.toSize);
		if (j.toSize < physics * (1 - LEAN_TOLERANCE)) {
			out.push({
				code: 'leaner-than-physics',
				severity: 'caution',
				message: `Jet ${j.toSize} is leaner than the ${physics.toFixed(1)} the change of air suggests. A lean engine runs hot and can seize: go richer and read the plug.`
			});
		}
	}
	return out;
}
