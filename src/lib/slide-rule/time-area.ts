import { z } from 'zod';
import * as t from '../tuning';
import { FieldError, fmt, on, row, type CalcResult } from './types';

const len = z.number().positive().max(500);
const portMode = z.enum(['height', 'duration']);

export const timeAreaSchema = z.object({
	units: z.enum(['metric', 'imperial']),
	bore: len,
	stroke: len,
	rod: len,
	exhaustWidth: len,
	exhaustMode: portMode.default('height'),
	exhaust: z.number().positive().max(500),
	transferWidth: len,
	transferMode: portMode.default('height'),
	transfer: z.number().positive().max(500),
	rpm: z.number().positive().max(30000)
});
export type TimeAreaInput = z.infer<typeof timeAreaSchema>;

/**
 * Specific time-area targets at the rpm of peak power, s/m, as tuners quote Jennings (1973) from
 * an SAE racing-engine paper (exhaust 0.00014–0.00015, transfers 0.00008–0.00010 s·cm²/cm³;
 * × 100 for s/m): the low end for broad, road power, the high end for high-revving engines.
 * A secondary source, not checked against the book; Blair (1996, ch. 6) gives his own by engine
 * type. No blowdown target is given: it depends on how hard the pipe pulls.
 */
export const TIME_AREA_TARGETS = {
	exhaust: { from: 0.014, to: 0.015 },
	transfer: { from: 0.008, to: 0.01 }
} as const;

export function computeTimeArea(i: TimeAreaInput): CalcResult {
	const imp = i.units === 'imperial';
	const toMm = (x: number) => (imp ? t.inToMm(x) : x);
	const bore = toMm(i.bore);
	const stroke = toMm(i.stroke);
	const rod = toMm(i.rod);
	on('rod', () => t.pistonDropMm(0, stroke, rod));
	const top = (mode: 'height' | 'duration', v: number, field: string) =>
		on(field, () =>
			mode === 'duration'
				? t.portTopForDurationDeg(v, stroke, rod)
				: (t.portOpenDeg(toMm(v), stroke, rod), toMm(v))
		);
	const exTop = top(i.exhaustMode, i.exhaust, 'exhaust');
	const trTop = top(i.transferMode, i.transfer, 'transfer');
	if (trTop <= exTop)
		throw new FieldError(
			'transfer',
			'The transfers must open after the exhaust: their roof sits lower.'
		);
	const cc = t.displacementCc(bore, stroke);
	const exOpen = t.portOpenDeg(exTop, stroke, rod);
	const trOpen = t.portOpenDeg(trTop, stroke, rod);
	const exWidth = toMm(i.exhaustWidth);
	const trWidth = toMm(i.transferWidth);
	if (exWidth > bore)
		throw new FieldError('exhaustWidth', 'Wider than the bore: give the port’s chord width.');
	const angle = {
		exhaust: t.portAngleAreaMm2Deg(exWidth, exTop, stroke, rod),
		transfer: t.portAngleAreaMm2Deg(trWidth, trTop, stroke, rod),
		blowdown: t.portAngleAreaMm2Deg(exWidth, exTop, stroke, rod, trOpen)
	};
	const sta = (a: number) => t.specificTimeAreaSPerM(a, i.rpm, cc);
	const areaRow = (key: string, label: string, mm2deg: number) =>
		imp ? row(key, label, mm2deg / 645.16, 'in²·°', 2) : row(key, label, mm2deg, 'mm²·°', 0);
	const rows = [
		row('exhaustDuration', 'Exhaust duration', 360 - 2 * exOpen, '°', 1),
		row('transferDuration', 'Transfer duration', 360 - 2 * trOpen, '°', 1),
		row('blowdownDeg', 'Blowdown', trOpen - exOpen, '°', 1),
		row('blowdownMs', 'Blowdown time', ((trOpen - exOpen) / (6 * i.rpm)) * 1000, 'ms', 3),
		areaRow('exhaustAngleArea', 'Exhaust angle-area', angle.exhaust),
		areaRow('transferAngleArea', 'Transfer angle-area', angle.transfer),
		areaRow('blowdownAngleArea', 'Blowdown angle-area', angle.blowdown),
		target(
			'exhaustSta',
			'Exhaust specific time-area',
			sta(angle.exhaust),
			TIME_AREA_TARGETS.exhaust
		),
		target(
			'transferSta',
			'Transfer specific time-area',
			sta(angle.transfer),
			TIME_AREA_TARGETS.transfer
		),
		row('blowdownSta', 'Blowdown specific time-area', sta(angle.blowdown), 's/m', 5),
		row(
			'exhaustRpm',
			'Engine speed the exhaust suits (quoted range’s middle)',
			angle.exhaust / (6 * cc * mid(TIME_AREA_TARGETS.exhaust)),
			'rpm',
			0
		),
		row(
			'transferRpm',
			'Engine speed the transfers suit (quoted range’s middle)',
			angle.transfer / (6 * cc * mid(TIME_AREA_TARGETS.transfer)),
			'rpm',
			0
		)
	];
	const notes = [
		`Specific time-area: the port’s open area integrated over the time it is open at ${fmt(i.rpm)} rpm, over the ${fmt(cc, 1)} cc swept volume (Blair’s measure, s/m). Targets quoted from Jennings (1973) through a secondary source: exhaust ${TIME_AREA_TARGETS.exhaust.from}–${TIME_AREA_TARGETS.exhaust.to}, transfers ${TIME_AREA_TARGETS.transfer.from}–${TIME_AREA_TARGETS.transfer.to} s/m.`,
		'Ports are taken as rectangles the full width to the roof: radiused corners, bridges and the transfers’ angles give less. Give the transfers’ widths added together.'
	];
	return { rows, warnings: [], notes };
}

const mid = (r: { from: number; to: number }) => (r.from + r.to) / 2;

function target(key: string, label: string, v: number, r: { from: number; to: number }) {
	const where =
		v < r.from
			? `Below the quoted ${r.from}–${r.to} s/m: this port runs out of breath before that rpm.`
			: v > r.to
				? `Above the quoted ${r.from}–${r.to} s/m: area to spare at that rpm (or aim higher).`
				: `Inside the quoted ${r.from}–${r.to} s/m.`;
	return row(key, label, v, 's/m', 5, where);
}
