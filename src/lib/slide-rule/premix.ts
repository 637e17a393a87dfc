import { z } from 'zod';
import * as t from '../tuning';
import { FieldError, fmt, on, row, within, type CalcResult } from './types';

const ratio = z.number().positive();

export const premixSchema = z.object({
	units: z.enum(['metric', 'imperial']),
	fuel: z.number().positive().max(1000),
	ratio,
	tank: z.number().nonnegative().max(1000).optional(),
	currentRatio: ratio.optional(),
	add: z.number().nonnegative().max(1000).optional(),
	targetRatio: ratio.optional()
});
export type PremixInput = z.infer<typeof premixSchema>;

const TOP_UP = ['tank', 'currentRatio', 'add', 'targetRatio'] as const;

export function computePremix(i: PremixInput): CalcResult {
	const imp = i.units === 'imperial';
	const toL = (v: number) => (imp ? t.galToL(v) : v);
	const oil = (key: string, label: string, ml: number) =>
		imp ? row(key, label, t.mlToFlOz(ml), 'fl oz', 2) : row(key, label, ml, 'ml', 0);
	for (const f of ['ratio', 'currentRatio', 'targetRatio'] as const)
		if (i[f] !== undefined) within(f, i[f]!, 10, 200, ': 1');
	const rows = [
		oil(
			'oil',
			'Oil for that fuel',
			on('fuel', () => t.premixOilMl(toL(i.fuel), i.ratio))
		),
		oil(
			'oilPerUnit',
			imp ? 'Oil per US gallon' : 'Oil per litre',
			t.premixOilMl(imp ? t.galToL(1) : 1, i.ratio)
		)
	];
	const notes = [
		'Ratios are by volume, fuel to oil. Measure the oil with a marked cup, pour it in with part of the fuel, shake, then add the rest.'
	];
	const given = TOP_UP.filter((f) => i[f] !== undefined);
	if (given.length && given.length < TOP_UP.length)
		throw new FieldError(
			TOP_UP.find((f) => i[f] === undefined)!,
			'To top up, give all four: what the tank holds, its ratio, the fuel you add and the ratio you want.'
		);
	if (given.length === TOP_UP.length) {
		const r = t.premixBalance({
			tankLitres: toL(i.tank!),
			currentRatio: i.currentRatio!,
			addLitres: toL(i.add!),
			targetRatio: i.targetRatio!
		});
		if (r.moreFuelLitres > 0)
			throw new FieldError(
				'targetRatio',
				`The tank already holds more oil than ${fmt(i.targetRatio!)}:1 allows: add at least ${imp ? `${fmt(t.lToGal(r.moreFuelLitres), 2)} US gal` : `${fmt(r.moreFuelLitres, 2)} L`} more fuel.`
			);
		rows.push(oil('topUpOil', 'Oil to add with the top-up', r.oilMl));
		notes.push(
			'The tank’s mix counts as fuel and oil in its ratio; the oil to add brings all of it to the new ratio.'
		);
	}
	return { rows, warnings: [], notes };
}
