import { z } from 'zod';
import * as t from '../tuning';
import { fmt, on, row, type CalcResult } from './types';

export const carbSchema = z.object({
	units: z.enum(['metric', 'imperial']),
	displacementCc: z.number().positive().max(2000),
	peakRpm: z.number().positive().max(30000),
	k: z.number().min(0.5).max(1.1).default(0.8)
});
export type CarbInput = z.infer<typeof carbSchema>;

export function computeCarb(i: CarbInput): CalcResult {
	const imp = i.units === 'imperial';
	const c = on('displacementCc', () => t.carbBoreMm(i.displacementCc, i.peakRpm, i.k));
	const len = (key: string, label: string, mm: number, note?: string) =>
		imp ? row(key, label, t.mmToIn(mm), 'in', 3, note) : row(key, label, mm, 'mm', 1, note);
	const show = (mm: number) => (imp ? `${fmt(t.mmToIn(mm), 2)} in` : `${fmt(mm, 0)} mm`);
	const rows = [
		len(
			'bore',
			`Carburettor bore at K = ${fmt(i.k, 2)}`,
			c.boreMm,
			t.plausibilityNote('carbBoreMm', c.boreMm, show)
		),
		len('from', 'Broad, road end (K = 0.65)', c.fromMm),
		len('to', 'Racing end (K = 0.9)', c.toMm)
	];
	const notes = [
		`D = K·√(V·N) with V = ${fmt(i.displacementCc)} cc as litres and N = ${fmt(i.peakRpm)} rpm. A smaller bore pulls harder low down; a bigger one breathes at the top but needs the pipe and porting to use it.`,
		t.plausibilityNote('displacementCc', i.displacementCc, (x) => `${fmt(x)} cc`) ??
			t.plausibilityNote('rpm', i.peakRpm, (x) => `${fmt(x)} rpm`) ??
			'Carburettors come in whole or half millimetres: pick the nearest size your kit offers and jet it from rich.'
	];
	return { rows, warnings: [], notes };
}
