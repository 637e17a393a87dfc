// Cylinder geometry for two-stroke (and four-stroke) engines.
import { between, finite, inside, positive } from './check';

const rad = (deg: number) => (deg * Math.PI) / 180;
const deg = (r: number) => (r * 180) / Math.PI;

/** Swept volume V = π/4 · B² · S (cylinder geometry), in cm³. */
export function displacementCc(boreMm: number, strokeMm: number): number {
	positive('boreMm', boreMm);
	positive('strokeMm', strokeMm);
	return ((Math.PI / 4) * boreMm * boreMm * strokeMm) / 1000;
}

/** Geometric compression ratio (Vs + Vc) / Vc — Heywood, ICE Fundamentals (1988) eq. 2.2. */
export function geometricCompressionRatio(sweptCc: number, chamberCc: number): number {
	positive('sweptCc', sweptCc);
	positive('chamberCc', chamberCc);
	return (sweptCc + chamberCc) / chamberCc;
}

function checkRod(strokeMm: number, rodMm: number) {
	positive('strokeMm', strokeMm);
	positive('rodMm', rodMm);
	if (rodMm <= strokeMm / 2)
		throw new RangeError(
			`rodMm must be longer than half the stroke (${strokeMm / 2} mm), got ${rodMm}`
		);
}

/**
 * Crown distance below its TDC position at a crank angle (crank-slider):
 * s(θ) = r(1 − cos θ) + l − √(l² − r² sin² θ), r = S/2 — Heywood (1988) eq. 2.5.
 */
export function pistonDropMm(crankDegFromTdc: number, strokeMm: number, rodMm: number): number {
	checkRod(strokeMm, rodMm);
	if (!Number.isFinite(crankDegFromTdc))
		throw new RangeError(`crankDegFromTdc must be a finite number (got ${crankDegFromTdc})`);
	const t = rad(((crankDegFromTdc % 360) + 360) % 360);
	const r = strokeMm / 2;
	const l = rodMm;
	return r * (1 - Math.cos(t)) + l - Math.sqrt(l * l - r * r * Math.sin(t) ** 2);
}

/**
 * Crank angle after TDC at which the crown edge reaches a port roof h below its TDC position:
 * the pin sits y = r + l − h from the crank axis, and the law of cosines gives
 * cos θ = (y² + r² − l²) / (2 y r) (inverse of Heywood eq. 2.5).
 */
export function portOpenDeg(portTopBelowTdcMm: number, strokeMm: number, rodMm: number): number {
	checkRod(strokeMm, rodMm);
	inside('portTopBelowTdcMm', portTopBelowTdcMm, 0, strokeMm);
	return angleForDrop(portTopBelowTdcMm, strokeMm, rodMm);
}

/** The crank angle (0…180°) at which the crown is `drop` below TDC, checked arguments. */
function angleForDrop(drop: number, strokeMm: number, rodMm: number): number {
	const r = strokeMm / 2;
	const l = rodMm;
	const y = r + l - drop;
	const c = (y * y + r * r - l * l) / (2 * y * r);
	// With 0 ≤ h ≤ S, c lies in [−1, 1]; the clamp only absorbs floating-point noise at the ends.
	return deg(Math.acos(Math.min(1, Math.max(-1, c))));
}

/** Port open duration, symmetric about BDC: 360° − 2 × opening angle. */
export function portDurationDeg(
	portTopBelowTdcMm: number,
	strokeMm: number,
	rodMm: number
): number {
	return 360 - 2 * portOpenDeg(portTopBelowTdcMm, strokeMm, rodMm);
}

/** The roof height for a duration: the inverse of portDurationDeg. */
export function portTopForDurationDeg(
	durationDeg: number,
	strokeMm: number,
	rodMm: number
): number {
	checkRod(strokeMm, rodMm);
	inside('durationDeg', durationDeg, 0, 360);
	return pistonDropMm((360 - durationDeg) / 2, strokeMm, rodMm);
}

/**
 * Trapped compression ratio (π/4 · B² · h_ex + Vc) / Vc, h_ex the exhaust roof's distance below
 * the crown edge at TDC — G. P. Blair, Design and Simulation of Two-Stroke Engines (SAE, 1996).
 */
export function trappedCompressionRatio(
	boreMm: number,
	strokeMm: number,
	exhaustTopBelowTdcMm: number,
	chamberCc: number
): number {
	positive('boreMm', boreMm);
	positive('strokeMm', strokeMm);
	inside('exhaustTopBelowTdcMm', exhaustTopBelowTdcMm, 0, strokeMm);
	positive('chamberCc', chamberCc);
	const trappedCc = displacementCc(boreMm, exhaustTopBelowTdcMm);
	return (trappedCc + chamberCc) / chamberCc;
}

/** Mean piston speed 2 · S · N / 60 in m/s — Heywood (1988) eq. 2.1. */
export function meanPistonSpeedMs(strokeMm: number, rpm: number): number {
	positive('strokeMm', strokeMm);
	positive('rpm', rpm);
	return (2 * (strokeMm / 1000) * rpm) / 60;
}

export type SquishAdvice = {
	minMm: number;
	maxMm: number;
	/** Below this the piston can touch the head at high rpm. */
	riskyBelowMm: number;
	verdict: 'tight' | 'ok' | 'loose';
	source: string;
};

/**
 * Squish clearance advice for small air-cooled road two-strokes. Common practice, no published
 * source: roughly 0.7–1.0 mm for 40–50 mm bores, risky below about 0.6 mm; bigger bores get
 * about 0.01 mm more per mm of bore over 50 (more piston rock and growth).
 */
export function squishAdvice(boreMm: number, squishMm: number): SquishAdvice {
	positive('boreMm', boreMm);
	positive('squishMm', squishMm);
	const extra = Math.max(0, boreMm - 50) * 0.01;
	const minMm = 0.7 + extra;
	const maxMm = 1.0 + extra;
	const verdict = squishMm < minMm ? 'tight' : squishMm > maxMm ? 'loose' : 'ok';
	return {
		minMm,
		maxMm,
		riskyBelowMm: 0.6 + extra,
		verdict,
		source:
			'Common practice for small air-cooled road two-strokes, no published source: the band grows a little with the bore (more piston rock and growth). Measure with crushed solder at several points.'
	};
}

/**
 * Crank angle from TDC at which the crown has dropped dropMm: the exact inverse of pistonDropMm
 * on 0…180° (law of cosines on the crank-slider triangle, as in portOpenDeg), for setting the
 * ignition with a dial gauge in the plug hole.
 */
export function crankDegForDropMm(dropMm: number, strokeMm: number, rodMm: number): number {
	checkRod(strokeMm, rodMm);
	between('dropMm', dropMm, 0, strokeMm);
	return angleForDrop(dropMm, strokeMm, rodMm);
}

/**
 * TDC by the piston-stop method: a stop in the plug hole, the crank turned each way onto it, the
 * degree wheel read at both stops; TDC lies halfway between them on the arc the crank swept
 * (the shorter one). Readings are wheel degrees, 0…360; the answer is too.
 */
export function tdcFromStopsDeg(firstDeg: number, secondDeg: number): number {
	finite('firstDeg', firstDeg);
	finite('secondDeg', secondDeg);
	const d = ((((secondDeg - firstDeg) % 360) + 540) % 360) - 180;
	return (((firstDeg + d / 2) % 360) + 360) % 360;
}

/** A port's duration from the wheel readings where it opens and closes (turning forward). */
export function durationFromWheelDeg(opensDeg: number, closesDeg: number): number {
	finite('opensDeg', opensDeg);
	finite('closesDeg', closesDeg);
	return (((closesDeg - opensDeg) % 360) + 360) % 360 || 360;
}

/**
 * Time a port stays open, s: θ / (6·N) (a degree lasts 1/(6N) s at N rpm). Jennings (1973)
 * works it for a 172° exhaust at 7,000 rpm: 0.0041 s.
 */
export function portOpenSeconds(durationDeg: number, rpm: number): number {
	inside('durationDeg', durationDeg, 0, 360);
	positive('rpm', rpm);
	return durationDeg / (6 * rpm);
}

/**
 * Angle-area of a rectangular port, mm²·°: ∫ A(θ) dθ while it is open, A = width × the height
 * the crown has uncovered (s(θ) − roof, at most to BDC), integrated by Simpson's rule over 0.1°
 * steps from the opening to `untilDeg` (default: its closing, 360° − opening). Radiused corners
 * would give a little less.
 */
export function portAngleAreaMm2Deg(
	widthMm: number,
	topMm: number,
	strokeMm: number,
	rodMm: number,
	untilDeg?: number
): number {
	positive('widthMm', widthMm);
	const open = portOpenDeg(topMm, strokeMm, rodMm);
	const end = untilDeg === undefined ? 360 - open : between('untilDeg', untilDeg, 0, 360 - open);
	if (end <= open) return 0;
	const n = Math.max(2, 2 * Math.ceil((end - open) / 0.2));
	const h = (end - open) / n;
	const area = (th: number) => widthMm * Math.max(0, pistonDropMm(th, strokeMm, rodMm) - topMm);
	let sum = area(open) + area(end);
	for (let i = 1; i < n; i++) sum += (i % 2 ? 4 : 2) * area(open + i * h);
	return (sum * h) / 3;
}

/**
 * Specific time-area, s/m: the angle-area as time at N rpm over the swept volume,
 * (∫A dθ / 6N) / Vs — the measure of Blair, Design and Simulation of Two-Stroke Engines (1996),
 * ch. 6, so ports of engines of any size compare.
 */
export function specificTimeAreaSPerM(
	angleAreaMm2Deg: number,
	rpm: number,
	sweptCc: number
): number {
	nonNegativeArea(angleAreaMm2Deg);
	positive('rpm', rpm);
	positive('sweptCc', sweptCc);
	// mm²·° → m²·s: × 1e-6 / (6·rpm); cc → m³: × 1e-6.
	return angleAreaMm2Deg / (6 * rpm * sweptCc);
}
const nonNegativeArea = (v: number) => {
	finite('angleAreaMm2Deg', v);
	if (v < 0) throw new RangeError(`angleAreaMm2Deg must not be negative (got ${v})`);
};

/** Jennings's wave speed for expansion chambers: 1,700 ft/s. */
export const JENNINGS_WAVE_SPEED_MS = 1700 * 0.3048;

/**
 * Speed of a pressure wave in the exhaust, a = √(γ·R·T), as Blair (1996, ch. 2) has it: it
 * follows the gas temperature. γ = 1.4 and R = 287 J/(kg·K) (air's; exhaust gas differs a
 * little, from memory).
 */
export function exhaustWaveSpeedMs(gasTempC: number): number {
	between('gasTempC', gasTempC, -50, 1200);
	return Math.sqrt(1.4 * 287.05 * (gasTempC + 273.15));
}

/**
 * Expansion chamber tuned length, mm: the exhaust pulse goes out and its reflection comes back
 * while the port is open, L = θ·c / (12·N) (θ exhaust duration in degrees, c wave speed, N rpm);
 * Jennings, Two-Stroke Tuner's Handbook (1973): 180° at 6,300 rpm with 1,700 ft/s is 48.57 in.
 */
export function tunedLengthMm(
	exhaustDurationDeg: number,
	rpm: number,
	waveSpeedMs: number = JENNINGS_WAVE_SPEED_MS
): number {
	inside('exhaustDurationDeg', exhaustDurationDeg, 0, 360);
	positive('rpm', rpm);
	between('waveSpeedMs', waveSpeedMs, 200, 1000);
	return ((exhaustDurationDeg * waveSpeedMs) / (12 * rpm)) * 1000;
}

/**
 * Carburettor bore from displacement and the rpm of peak power: D = K·√(V·N), D in mm, V in
 * litres, N rpm, K about 0.65 (broad, road) to 0.9 (racing) — A. G. Bell, Two-Stroke Performance
 * Tuning (1999), from memory.
 */
export function carbBoreMm(
	displacementCc: number,
	peakRpm: number,
	k = 0.8
): { boreMm: number; fromMm: number; toMm: number } {
	positive('displacementCc', displacementCc);
	positive('peakRpm', peakRpm);
	between('k', k, 0.5, 1.1);
	const root = Math.sqrt((displacementCc / 1000) * peakRpm);
	return { boreMm: k * root, fromMm: 0.65 * root, toMm: 0.9 * root };
}
