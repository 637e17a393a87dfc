import { z } from 'zod';
import * as t from '../tuning';
import { fmt, on, row, type CalcResult } from './types';

const dia = z.number().positive().max(1000);

export const beltSchema = z.object({
	units: z.enum(['metric', 'imperial']),
	drive: dia,
	driven: dia,
	centre: z.number().positive().max(2000).optional()
});
export type BeltInput = z.infer<typeof beltSchema>;

export function computeBelt(i: BeltInput): CalcResult {
	const imp = i.units === 'imperial';
	const toMm = (x: number) => (imp ? t.inToMm(x) : x);
	const show = (mm: number) => (imp ? `${fmt(t.mmToIn(mm), 2)} in` : `${fmt(mm, 0)} mm`);
	const drive = toMm(i.drive);
	const driven = toMm(i.driven);
	const ratio = t.cvtRatio(drive, driven);
	const rows = [
		row(
			'ratio',
			'CVT ratio (engine ÷ driven pulley)',
			ratio,
			': 1',
			3,
			t.plausibilityNote('pulleyDiaMm', drive, show) ??
				t.plausibilityNote('pulleyDiaMm', driven, show) ??
				(ratio < 1.6
					? t.plausibilityNote('topCvtRatio', ratio)
					: t.plausibilityNote('launchCvtRatio', ratio))
		)
	];
	const notes = [
		'Pitch diameters: where the belt’s middle runs on each pulley, not the pulley’s rim. Mark the belt’s track on the faces with a pen and measure across.'
	];
	if (i.centre !== undefined) {
		const l = on('centre', () => t.beltPitchLengthMm(drive, driven, toMm(i.centre!)));
		rows.push(
			imp
				? row('beltLength', 'Belt pitch length', t.mmToIn(l), 'in', 2)
				: row('beltLength', 'Belt pitch length', l, 'mm', 1)
		);
		notes.push(
			'Belts are sold by pitch (or outside) length: check which the number on the belt means.'
		);
	}
	return { rows, warnings: [], notes };
}
