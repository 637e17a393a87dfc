import { z } from 'zod';
import * as t from '../tuning';
import { FieldError, fmt, on, row, within, type CalcResult } from './types';

const len = z.number().positive().max(500);
const wheel = z.number().min(-360).max(720);

export const dialGaugeSchema = z.object({
	units: z.enum(['metric', 'imperial']),
	stroke: len,
	rod: len,
	mode: z.enum(['degrees', 'drop']).default('degrees'),
	value: z.number().nonnegative().optional(),
	stopFirst: wheel.optional(),
	stopSecond: wheel.optional(),
	opens: wheel.optional(),
	closes: wheel.optional()
});
export type DialGaugeInput = z.infer<typeof dialGaugeSchema>;

export function computeDialGauge(i: DialGaugeInput): CalcResult {
	const imp = i.units === 'imperial';
	const toMm = (x: number) => (imp ? t.inToMm(x) : x);
	const lenUnit = imp ? 'in' : 'mm';
	const stroke = toMm(i.stroke);
	const rod = on('rod', () => {
		t.pistonDropMm(0, stroke, toMm(i.rod));
		return toMm(i.rod);
	});
	const rows = [];
	const notes: string[] = [];
	if (i.value !== undefined) {
		if (i.mode === 'degrees') {
			within('value', i.value, 0, 180, '° before TDC');
			const mm = t.pistonDropMm(i.value, stroke, rod);
			rows.push(
				imp
					? row('drop', `Piston below TDC at ${fmt(i.value)}°`, t.mmToIn(mm), 'in', 4)
					: row('drop', `Piston below TDC at ${fmt(i.value)}°`, mm, 'mm', 2)
			);
		} else {
			within('value', i.value, 0, i.stroke, lenUnit);
			const deg = t.crankDegForDropMm(toMm(i.value), stroke, rod);
			rows.push(row('degrees', `Crank angle at ${fmt(i.value)} ${lenUnit} below TDC`, deg, '°', 2));
		}
		notes.push(
			'Zero the gauge with the piston at TDC, turn back past the mark, then come up to it in the running direction so the gauge and crank take up their play the same way.'
		);
	}
	const stops = [i.stopFirst, i.stopSecond];
	if (stops.some((s) => s !== undefined)) {
		if (stops.some((s) => s === undefined))
			throw new FieldError(
				i.stopFirst === undefined ? 'stopFirst' : 'stopSecond',
				'Give the wheel reading at both stops.'
			);
		const tdc = t.tdcFromStopsDeg(i.stopFirst!, i.stopSecond!);
		rows.push(row('tdc', 'TDC on your wheel (piston stop)', tdc, '°', 1));
		const off = ((tdc + 180) % 360) - 180;
		notes.push(
			Math.abs(off) < 0.05
				? 'The wheel’s zero is at TDC already.'
				: `Move the wheel (or the pointer) ${fmt(Math.abs(off), 1)}° so it reads 0 at TDC, then take the port readings.`
		);
	}
	if (i.opens !== undefined || i.closes !== undefined) {
		if (i.opens === undefined || i.closes === undefined)
			throw new FieldError(
				i.opens === undefined ? 'opens' : 'closes',
				'Give the wheel reading where the port opens and where it closes.'
			);
		const duration = t.durationFromWheelDeg(i.opens, i.closes);
		rows.push(row('duration', 'Port duration', duration, '°', 1));
		const tdc = stops.every((s) => s !== undefined)
			? t.tdcFromStopsDeg(i.stopFirst!, i.stopSecond!)
			: 0;
		const opensAtdc = (((i.opens - tdc) % 360) + 360) % 360;
		rows.push(row('opensAtdc', 'Opens after TDC', opensAtdc, '°', 1));
		notes.push(
			'A port opens and closes symmetrically about BDC: if the two halves differ, recheck TDC.'
		);
	}
	if (!rows.length)
		throw new FieldError(
			'value',
			'Give a timing to convert, the two stop readings, or a port’s readings.'
		);
	return { rows, warnings: [], notes };
}
