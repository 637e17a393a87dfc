import { z } from 'zod';
import * as t from '../tuning';
import { airRows, conditions, placeShape } from './air-and-jets';
import { changeRow, fmt, on, row, type CalcResult } from './types';

export const retuneSchema = z.object({
	units: z.enum(['metric', 'imperial']),
	jet: z.number().positive().max(1000),
	numbering: z.enum(['diameter', 'flow']).default('diameter'),
	step: z.number().positive().max(50).default(2),
	fromElevation: placeShape.elevation,
	fromTemp: placeShape.temp,
	fromHumidity: placeShape.humidity,
	fromPressure: placeShape.pressure,
	fromPressureKind: placeShape.pressureKind,
	toElevation: placeShape.elevation,
	toTemp: placeShape.temp,
	toHumidity: placeShape.humidity,
	toPressure: placeShape.pressure,
	toPressureKind: placeShape.pressureKind
});
export type RetuneInput = z.infer<typeof retuneSchema>;

/** The two places of a retune: where the engine was jetted, and where it will be ridden. */
export const PLACES = { from: 'where it was jetted', to: 'where it will be ridden' } as const;

const place = (i: RetuneInput, side: 'from' | 'to') => ({
	elevation: i[`${side}Elevation`],
	temp: i[`${side}Temp`],
	humidity: i[`${side}Humidity`],
	pressure: i[`${side}Pressure`],
	pressureKind: i[`${side}PressureKind`]
});

/** "2 steps leaner", "1 step richer", "no change": the words always match the number. */
export function saySteps(n: number): string {
	if (n === 0) return 'no change';
	return `${Math.abs(n)} step${Math.abs(n) === 1 ? '' : 's'} ${n > 0 ? 'richer' : 'leaner'}`;
}

export function computeRetune(i: RetuneInput): CalcResult {
	const imp = i.units === 'imperial';
	const from = conditions(place(i, 'from'), imp, 'from');
	const to = conditions(place(i, 'to'), imp, 'to');
	const a = t.airAt(from);
	const b = t.airAt(to);
	const physics = t.retargetJetForAir(i.jet, from, to, i.numbering);
	const rule = on('toElevation', () =>
		t.ruleOfThumbJet(i.jet, from.elevationM, to.elevationM, i.step)
	);
	const p = t.jetOnLadder(i.jet, physics, i.step);
	// Real sizes print as the rider writes their own: as many decimals as the jet or the step has.
	const sizeDecimals = Math.max(decimalsOf(i.jet), decimalsOf(i.step));
	const r = t.jetOnLadder(i.jet, rule, i.step);
	// The answer first (what a shop prints), then the air it comes from.
	const rows = [
		row('physicsJet', 'Jet to fit (physics)', p.size, '', sizeDecimals),
		changeRow('physicsSteps', 'Steps from your jet (physics)', p.steps, 'steps', 0),
		row('physics', 'Main jet by the air physics (exact)', physics, '', 2),
		row('ruleJet', 'Jet to fit (rule of thumb)', r.size, '', sizeDecimals),
		changeRow('ruleSteps', 'Steps from your jet (rule of thumb)', r.steps, 'steps', 0),
		row('rule', 'Main jet by the 1,000 ft rule of thumb', rule, '', 2),
		changeRow(
			'dryDensityChange',
			'Dry-air density change',
			100 * (b.dryDensityKgM3 / a.dryDensityKgM3 - 1),
			'%',
			1
		),
		...airRows(a, imp, 'from', 'jetted'),
		...airRows(b, imp, 'to', 'ridden')
	];
	const notes = [
		`Physics: ${saySteps(p.steps)}, to ${fmt(p.size)}. Rule of thumb: ${saySteps(r.steps)}, to ${fmt(r.size)}.`,
		ruleComparison(i.jet, physics, rule, i.numbering),
		'Both answers sit on your own ladder: your jet plus or minus whole steps. Start from the physics jet, change one thing at a time, and let the spark plug colour and the head temperature decide.'
	];
	const warnings = t.speedWarnings({
		jetChange: { fromSize: i.jet, toSize: r.size, from, to, numbering: i.numbering },
		units: i.units
	});
	return { rows, warnings, notes };
}

const decimalsOf = (x: number) => {
	const s = String(Number(x.toPrecision(12)));
	return s.includes('.') ? Math.min(3, s.split('.')[1].length) : 0;
};

/** How far the rule moves against the physics, for the case on the sheet. */
function ruleComparison(jet: number, physics: number, rule: number, numbering: string): string {
	const scale =
		numbering === 'diameter'
			? 'For jets numbered by orifice diameter the physics moves the size with the square root of the jet area it needs'
			: 'For jets numbered by flow the physics moves the size with the jet area it needs';
	const dp = physics - jet;
	const dr = rule - jet;
	let how: string;
	if (Math.abs(dp) < 1e-9)
		how =
			Math.abs(dr) < 1e-9
				? 'here neither moves.'
				: 'here the physics does not move at all, and the rule moves by elevation alone.';
	else if (Math.abs(dr) < 1e-9)
		how =
			'here the rule does not move (same elevation) while the temperature, humidity or pressure moves the physics.';
	else if (Math.sign(dp) !== Math.sign(dr))
		how = 'here the rule even moves the other way, because it knows only the elevation.';
	else how = `here the rule moves ${fmt(dr / dp, 1)} times as far as the physics.`;
	return `${scale}; the one-size-per-1,000-ft rule (common practice, no published source) ignores temperature, humidity and pressure: ${how}`;
}
