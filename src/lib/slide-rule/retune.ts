import { z } from 'zod';
import * as t from '../tuning';
import { conditions, placeShape } from './air-and-jets';
import { changeRow, on, row, type CalcResult } from './types';

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

const place = (i: RetuneInput, side: 'from' | 'to') =>
	side === 'from'
		? {
				elevation: i.fromElevation,
				temp: i.fromTemp,
				humidity: i.fromHumidity,
				pressure: i.fromPressure,
				pressureKind: i.fromPressureKind
			}
		: {
				elevation: i.toElevation,
				temp: i.toTemp,
				humidity: i.toHumidity,
				pressure: i.toPressure,
				pressureKind: i.toPressureKind
			};

/** Seasons a shop can pick for the target place (typical mid-latitude values, our own presets). */
export const SEASONS = {
	winter: { tempC: 2, humidity: 80 },
	spring: { tempC: 12, humidity: 70 },
	summer: { tempC: 27, humidity: 55 },
	autumn: { tempC: 12, humidity: 75 }
} as const;

export function computeRetune(i: RetuneInput): CalcResult {
	const imp = i.units === 'imperial';
	const from = conditions(place(i, 'from'), imp, 'from');
	const to = conditions(place(i, 'to'), imp, 'to');
	const a = t.airAt(from);
	const b = t.airAt(to);
	const physics = t.retargetJet(i.jet, a.densityKgM3, b.densityKgM3, i.numbering);
	const rule = on('toElevation', () =>
		t.ruleOfThumbJet(i.jet, from.elevationM, to.elevationM, i.step)
	);
	const physicsJet = t.nearestJet(physics, i.step);
	const ruleJet = on('step', () => t.nearestJet(rule, i.step));
	const rows = [
		row('fromDensity', 'Air density where it was tuned', a.densityKgM3, 'kg/m³', 4),
		row('toDensity', 'Air density at the target', b.densityKgM3, 'kg/m³', 4),
		changeRow('densityChange', 'Density change', 100 * (b.densityKgM3 / a.densityKgM3 - 1), '%', 1),
		row('physics', 'Main jet by the air-density physics', physics, '', 2),
		row('physicsJet', 'Nearest real jet (physics)', physicsJet, '', 1),
		row('rule', 'Main jet by the 1,000 ft rule of thumb', rule, '', 2),
		row('ruleJet', 'Nearest real jet (rule of thumb)', ruleJet, '', 1)
	];
	const steps = (x: number) => Math.round((x - i.jet) / i.step);
	const say = (n: number) =>
		n === 0
			? 'no change'
			: `${Math.abs(n)} step${Math.abs(n) === 1 ? '' : 's'} ${n > 0 ? 'richer' : 'leaner'}`;
	const notes = [
		`Physics: ${say(steps(physicsJet))}. Rule of thumb: ${say(steps(ruleJet))}.`,
		i.numbering === 'diameter'
			? 'For jets numbered by orifice diameter the physics scales the size with the fourth root of air density; the one-size-per-1,000-ft rule (common practice, no published source) moves two to three times as far, and ignores temperature and humidity.'
			: 'For jets numbered by flow the physics scales the size with the square root of air density; the one-size-per-1,000-ft rule is common practice with no published source, and ignores temperature and humidity.',
		'Start from the physics jet, change one thing at a time, and let the spark plug colour and the head temperature decide.'
	];
	const warnings = t.speedWarnings({
		jetChange: {
			fromSize: physics,
			toSize: ruleJet,
			fromDensityKgM3: b.densityKgM3,
			toDensityKgM3: b.densityKgM3,
			numbering: i.numbering
		}
	});
	return { rows, warnings, notes };
}
