import { z } from 'zod';
import * as t from '../tuning';
import { fmt, on, row, type CalcResult } from './types';

const len = z.number().positive().max(500);
const portMode = z.enum(['height', 'duration']);

export const cylinderSchema = z.object({
	units: z.enum(['metric', 'imperial']),
	bore: len,
	stroke: len,
	rod: len.optional(),
	chamberCc: z.number().positive().max(100).optional(),
	exhaustMode: portMode.default('height'),
	exhaust: z.number().positive().max(500).optional(),
	transferMode: portMode.default('height'),
	transfer: z.number().positive().max(500).optional(),
	rpm: z.number().positive().max(30000).optional(),
	squish: z.number().positive().max(10).optional()
});
export type CylinderInput = z.infer<typeof cylinderSchema>;

type Port = { openDeg: number; durationDeg: number; topMm: number };

function port(
	mode: 'height' | 'duration',
	value: number,
	strokeMm: number,
	rodMm: number,
	field: string,
	toMm: (x: number) => number
): Port {
	if (mode === 'duration') {
		const topMm = on(field, () => t.portTopForDurationDeg(value, strokeMm, rodMm));
		return { openDeg: (360 - value) / 2, durationDeg: value, topMm };
	}
	const topMm = toMm(value);
	return {
		openDeg: on(field, () => t.portOpenDeg(topMm, strokeMm, rodMm)),
		durationDeg: on(field, () => t.portDurationDeg(topMm, strokeMm, rodMm)),
		topMm
	};
}

export function computeCylinder(i: CylinderInput): CalcResult {
	const imp = i.units === 'imperial';
	const toMm = (x: number) => (imp ? t.inToMm(x) : x);
	const fromMm = (mm: number) => (imp ? t.mmToIn(mm) : mm);
	const lenUnit = imp ? 'in' : 'mm';
	const lenDec = imp ? 4 : 2;
	const bore = toMm(i.bore);
	const stroke = toMm(i.stroke);
	const cc = on('bore', () => t.displacementCc(bore, stroke));
	const lenText = (mm: number) => `${fmt(fromMm(mm), imp ? 2 : 0)} ${lenUnit}`;
	const rows = [
		row(
			'displacement',
			'Displacement',
			cc,
			'cc',
			2,
			t.plausibilityNote('boreMm', bore, lenText) ??
				t.plausibilityNote('strokeMm', stroke, lenText) ??
				t.plausibilityNote('displacementCc', cc, (x) => `${fmt(x)} cc`)
		)
	];
	if (imp) rows.push(row('displacementCubicIn', 'Displacement', t.ccToCubicIn(cc), 'in³', 3));
	const notes: string[] = [];
	if (i.chamberCc !== undefined) {
		const cr = t.geometricCompressionRatio(cc, i.chamberCc);
		rows.push(
			row(
				'compression',
				'Geometric compression ratio',
				cr,
				': 1',
				2,
				t.plausibilityNote('chamberCc', i.chamberCc, (x) => `${fmt(x)} cc`) ??
					t.plausibilityNote('compressionRatio', cr, (x) => `${fmt(x)} : 1`)
			)
		);
	}

	const rod = i.rod === undefined ? undefined : toMm(i.rod);
	let ex: Port | undefined;
	let tr: Port | undefined;
	if ((i.exhaust !== undefined || i.transfer !== undefined) && rod === undefined)
		notes.push('Port timing needs the con-rod length.');
	if (rod !== undefined) {
		on('rod', () => t.pistonDropMm(0, stroke, rod));
		if (i.exhaust !== undefined) ex = port(i.exhaustMode, i.exhaust, stroke, rod, 'exhaust', toMm);
		if (i.transfer !== undefined)
			tr = port(i.transferMode, i.transfer, stroke, rod, 'transfer', toMm);
	}
	for (const [p, key, name] of [
		[ex, 'exhaust', 'Exhaust'],
		[tr, 'transfer', 'Transfer']
	] as const) {
		if (!p) continue;
		rows.push(
			row(
				`${key}Duration`,
				`${name} duration`,
				p.durationDeg,
				'°',
				1,
				t.plausibilityNote(`${key}DurationDeg`, p.durationDeg, (x) => `${fmt(x)}°`)
			)
		);
		rows.push(row(`${key}Opens`, `${name} opens`, p.openDeg, '° ATDC', 1));
		rows.push(row(`${key}Top`, `${name} roof below TDC`, fromMm(p.topMm), lenUnit, lenDec));
	}
	if (ex && tr) {
		rows.push(
			row(
				'blowdown',
				'Blowdown (exhaust before transfers)',
				(ex.durationDeg - tr.durationDeg) / 2,
				'°',
				1
			)
		);
		if (tr.durationDeg >= ex.durationDeg)
			notes.push(
				'The transfers open before the exhaust: check the numbers, that engine would not run well.'
			);
	}
	if (ex && i.chamberCc !== undefined) {
		rows.push(
			row(
				'trappedCompression',
				'Trapped compression ratio',
				on('exhaust', () => t.trappedCompressionRatio(bore, stroke, ex.topMm, i.chamberCc!)),
				': 1',
				2
			)
		);
	}
	if (i.rpm !== undefined) {
		const ms = t.meanPistonSpeedMs(stroke, i.rpm);
		rows.push(
			imp
				? row('pistonSpeed', 'Mean piston speed', t.mToFt(ms), 'ft/s', 1)
				: row('pistonSpeed', 'Mean piston speed', ms, 'm/s', 2)
		);
	}
	if (i.squish !== undefined) {
		const a = on('squish', () => t.squishAdvice(bore, toMm(i.squish!)));
		rows.push(row('squishMin', 'Squish, advised from', fromMm(a.minMm), lenUnit, lenDec));
		rows.push(row('squishMax', 'Squish, advised to', fromMm(a.maxMm), lenUnit, lenDec));
		const say = {
			tight: 'tighter than the usual range',
			ok: 'inside the usual range',
			loose: 'looser than the usual range'
		}[a.verdict];
		const band = `${fmt(fromMm(a.minMm), lenDec)}–${fmt(fromMm(a.maxMm), lenDec)} ${lenUnit}`;
		notes.push(
			`Squish ${fmt(i.squish)} ${lenUnit} is ${say} for a ${lenText(bore)} bore (${band}). ${a.source}`
		);
		if (toMm(i.squish) < a.riskyBelowMm)
			notes.push(
				`Below about ${fmt(fromMm(a.riskyBelowMm), lenDec)} ${lenUnit} on this bore the piston can touch the head at high rpm. Do not run it like this.`
			);
		const odd = t.plausibilityNote('squishMm', toMm(i.squish), lenText);
		if (odd) notes.push(odd);
	}
	return { rows, warnings: [], notes };
}
