// Why a close build is close, in words a tuner uses.
import { grouped } from '../intl';

export type Target = {
	cc?: number;
	exhaust?: string;
	carb?: number;
	finalDrive?: number;
	tyreMm?: number;
	rollers?: number;
	jet?: number;
	elevation?: number;
};
export type Candidate = {
	cc: number | null;
	exhaust: string | null;
	carb: number | null;
	finalDrive: number | null;
	tyreMm: number | null;
	rollers: number | null;
	jet: number | null;
	elevation: number | null;
};

const PIPE: Record<string, string> = {
	stock: 'stock exhaust',
	sport: 'sport silencer',
	'expansion-chamber': 'expansion chamber'
};
const n = (x: number, d = 0) => grouped(x, d);

export function reasons(t: Target, c: Candidate): string[] {
	const out: string[] = [];
	if (t.exhaust && c.exhaust)
		out.push(
			t.exhaust === c.exhaust
				? `same pipe type (${PIPE[c.exhaust] ?? c.exhaust})`
				: `${PIPE[c.exhaust] ?? c.exhaust} instead of ${PIPE[t.exhaust] ?? t.exhaust}`
		);
	if (t.cc !== undefined && c.cc !== null)
		out.push(
			Math.abs(c.cc - t.cc) < 0.5 ? `same size (${n(c.cc)} cc)` : `${n(c.cc)} vs ${n(t.cc)} cc`
		);
	if (t.finalDrive !== undefined && c.finalDrive !== null) {
		const pct = (100 * (c.finalDrive - t.finalDrive)) / t.finalDrive;
		out.push(
			Math.abs(pct) < 0.5
				? 'same final drive'
				: `final drive ${n(Math.abs(pct))} % ${pct < 0 ? 'taller' : 'shorter'}`
		);
	}
	if (t.carb !== undefined && c.carb !== null && Math.abs(c.carb - t.carb) >= 0.5)
		out.push(`${n(c.carb)} mm carburettor vs ${n(t.carb)} mm`);
	if (t.tyreMm !== undefined && c.tyreMm !== null && Math.abs(c.tyreMm - t.tyreMm) >= 20)
		out.push(
			`rear tyre ${n(Math.abs(c.tyreMm - t.tyreMm))} mm ${c.tyreMm > t.tyreMm ? 'longer' : 'shorter'} round`
		);
	if (t.rollers !== undefined && c.rollers !== null && Math.abs(c.rollers - t.rollers) >= 0.5)
		out.push(
			`rollers ${n(Math.abs(c.rollers - t.rollers), 1)} g ${c.rollers > t.rollers ? 'heavier' : 'lighter'} in total`
		);
	if (t.jet !== undefined && c.jet !== null && Math.abs(c.jet - t.jet) >= 1)
		out.push(`sea-level jet ${n(c.jet)} vs ${n(t.jet)}`);
	if (t.elevation !== undefined && c.elevation !== null) {
		const d = c.elevation - t.elevation;
		out.push(
			Math.abs(d) < 100
				? 'tuned at about the same elevation'
				: `tuned ${n(Math.abs(d))} m ${d > 0 ? 'higher' : 'lower'}`
		);
	}
	return out;
}
