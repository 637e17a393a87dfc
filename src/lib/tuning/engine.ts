// Cylinder geometry for two-stroke (and four-stroke) engines.
import { inside, positive } from './check';

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
	const r = strokeMm / 2;
	const l = rodMm;
	const y = r + l - portTopBelowTdcMm;
	const c = (y * y + r * r - l * l) / (2 * y * r);
	// With 0 < h < S, c lies in [−1, 1]; the clamp only absorbs floating-point noise at the ends.
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
			'Common practice for small air-cooled road two-strokes (no published source): about 0.7–1.0 mm for 40–50 mm bores, risky below about 0.6 mm. Measure with crushed solder at several points.'
	};
}
