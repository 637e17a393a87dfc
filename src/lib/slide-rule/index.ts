import type { z } from 'zod';
import { airSchema, computeAir } from './air-and-jets';
import { computeCylinder, cylinderSchema } from './cylinder';
import { computeGearing, gearingSchema } from './gearing';
import { beltSchema, computeBelt } from './belt';
import { carbSchema, computeCarb } from './carb';
import { computeDialGauge, dialGaugeSchema } from './dial-gauge';
import { computePipe, pipeSchema } from './pipe';
import { computePremix, premixSchema } from './premix';
import { computeRetune, retuneSchema } from './retune';
import { computeTimeArea, timeAreaSchema } from './time-area';
import { FieldError, type CalcOutcome, type CalcResult } from './types';

export * from './types';
export { PLACES, saySteps } from './retune';

type Calculator = { schema: z.ZodType; compute: (input: never) => CalcResult };

/** The Slide rule calculators by URL name; pages and `POST /api/slide-rule/<name>` both use these. */
export const CALCULATORS = {
	cylinder: { schema: cylinderSchema, compute: computeCylinder },
	gearing: { schema: gearingSchema, compute: computeGearing },
	'air-and-jets': { schema: airSchema, compute: computeAir },
	retune: { schema: retuneSchema, compute: computeRetune },
	pipe: { schema: pipeSchema, compute: computePipe },
	'time-area': { schema: timeAreaSchema, compute: computeTimeArea },
	carb: { schema: carbSchema, compute: computeCarb },
	'dial-gauge': { schema: dialGaugeSchema, compute: computeDialGauge },
	premix: { schema: premixSchema, compute: computePremix },
	belt: { schema: beltSchema, compute: computeBelt }
} satisfies Record<string, Calculator>;

export type CalculatorName = keyof typeof CALCULATORS;

export const isCalculator = (name: string): name is CalculatorName =>
	Object.hasOwn(CALCULATORS, name);

/** Schema problems in the words the page shows beside a field. */
function plain(i: z.core.$ZodIssue, input: unknown): string {
	const given =
		input && typeof input === 'object'
			? (input as Record<string, unknown>)[String(i.path[0])]
			: undefined;
	switch (i.code) {
		case 'invalid_type':
			return given === undefined
				? 'Needed for this calculation.'
				: i.expected === 'number'
					? 'Enter a number.'
					: i.message;
		case 'too_small':
			return `Must be ${i.inclusive ? 'at least' : 'more than'} ${String(i.minimum)}.`;
		case 'too_big':
			return `Must be at most ${String(i.maximum)}.`;
		case 'invalid_value':
			return 'Pick one of the listed options.';
		default:
			return i.message;
	}
}

/** Validates and computes; input problems come back as issues naming the field, never as a throw. */
export function runCalculator(name: CalculatorName, input: unknown): CalcOutcome {
	const calc: Calculator = CALCULATORS[name];
	if (!input || typeof input !== 'object' || Array.isArray(input))
		return {
			ok: false,
			issues: [
				{
					path: '',
					message: `Send a JSON object of the inputs, such as {"units": "metric", …}; got ${input === null ? 'null' : Array.isArray(input) ? 'an array' : `a ${typeof input}`}.`
				}
			]
		};
	const parsed = calc.schema.safeParse(input);
	if (!parsed.success) {
		return {
			ok: false,
			issues: parsed.error.issues.map((i) => ({ path: i.path.join('.'), message: plain(i, input) }))
		};
	}
	try {
		return { ok: true, result: calc.compute(parsed.data as never) };
	} catch (e) {
		if (e instanceof FieldError)
			return { ok: false, issues: [{ path: e.path, message: e.message }] };
		if (e instanceof RangeError) return { ok: false, issues: [{ path: '', message: e.message }] };
		throw e;
	}
}
