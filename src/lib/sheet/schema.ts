// zod schemas generated from the field descriptions, in the units the person typed.
import { z } from 'zod';
import type { Field } from './fields';
import { PLACES, STORED_PLACES, toCanonical, toShown, UNIT, type Units } from './units';

export type Mode = 'draft' | 'complete';
export type SheetValues = Record<string, string | number | boolean | undefined>;

const nice = (x: number) => Number(x.toFixed(3));

function numberSchema(f: Field, units: Units) {
	const lo = f.dim ? toShown(f.min!, f.dim, units) : f.min!;
	const hi = f.dim ? toShown(f.max!, f.dim, units) : f.max!;
	// "size" marks a number that is a size in its own right (a tyre's rim): no unit to print.
	const unit = f.dim ? UNIT[f.dim][units] : f.unit && f.unit !== 'size' ? f.unit : '';
	const msg = `Between ${nice(lo)} and ${nice(hi)}${unit ? ' ' + unit : ''}.`;
	// Rounding slack so a value converted for display converts back inside the range.
	const slack = f.dim ? 10 ** -PLACES[f.dim][units] : 0;
	let s = z
		.number({ error: 'Enter a number.' })
		.min(lo - slack, { error: msg })
		.max(hi + slack, { error: msg });
	if (f.kind === 'int') s = s.int({ error: 'A whole number.' });
	return s;
}

function fieldSchema(f: Field, units: Units, mode: Mode): z.ZodType {
	const needed = f.always || (mode === 'complete' && !f.optional);
	switch (f.kind) {
		case 'checkbox':
			return z.boolean().default(false);
		case 'select': {
			const values = (f.options ?? []).map((o) => o.value).filter((v) => v !== '');
			if (!values.length) return z.string().default('');
			const error = 'Choose one.';
			if (f.preset) return z.enum(values as [string, ...string[]], { error }).default(f.preset);
			// '' is "not recorded": allowed unless the field is needed now, and then it is the prompt.
			const any = z.enum(['', ...values] as [string, ...string[]], { error });
			return needed ? any.refine((v) => v !== '', { error }) : any.default('');
		}
		case 'number':
		case 'int': {
			const s = numberSchema(f, units);
			return needed ? s : s.optional();
		}
		case 'date':
			return needed
				? z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { error: 'A date like 2026-05-31.' })
				: z
						.string()
						.regex(/^(\d{4}-\d{2}-\d{2})?$/, { error: 'A date like 2026-05-31.' })
						.default('');
		default: {
			let s = z
				.string()
				.trim()
				.max(f.maxLength ?? 200, { error: `At most ${f.maxLength ?? 200} characters.` });
			if (needed)
				s = s.min(Math.max(1, f.min ?? 1), {
					error: f.min && f.min > 1 ? `At least ${f.min} characters.` : 'Needed.'
				});
			const check = f.check;
			const checked = check
				? s.refine((v) => !v || check(v) === null, {
						error: (iss) => check(String(iss.input)) ?? 'Not valid.'
					})
				: s;
			return needed ? checked : checked.default('');
		}
	}
}

const cache = new Map<string, z.ZodObject>();

export function schemaFor(name: string, fields: Field[], units: Units, mode: Mode = 'draft') {
	const key = `${name}:${units}:${mode}`;
	let s = cache.get(key);
	if (!s) {
		s = z.object({
			units: z.enum(['metric', 'imperial']).default(units),
			...Object.fromEntries(fields.map((f) => [f.name, fieldSchema(f, units, mode)]))
		});
		cache.set(key, s);
	}
	return s;
}

/** A stored number at its field's precision (canonical units). */
export function atPrecision(f: Field, v: number): number {
	const places = f.dim ? STORED_PLACES[f.dim] : f.kind === 'int' ? 0 : (f.places ?? 3);
	return Number(v.toFixed(places));
}

/** Stored values with every number held at its field's precision; other values untouched. */
export function roundStored<T extends Record<string, unknown>>(fields: Field[], stored: T): T {
	const out: Record<string, unknown> = { ...stored };
	for (const f of fields) {
		const v = out[f.name];
		if (typeof v === 'number' && Number.isFinite(v)) out[f.name] = atPrecision(f, v);
	}
	return out as T;
}

/** Typed values → canonical units for storage. Empty numbers and dates become null, empty text ''. */
export function toStored(
	fields: Field[],
	values: SheetValues,
	units: Units
): Record<string, string | number | boolean | null> {
	const out: Record<string, string | number | boolean | null> = {};
	for (const f of fields) {
		const v = values[f.name];
		if (v === undefined || v === '')
			out[f.name] =
				f.kind === 'checkbox' ? false : f.kind === 'text' || f.kind === 'textarea' ? '' : null;
		else if (typeof v === 'number')
			out[f.name] = atPrecision(f, f.dim ? toCanonical(v, f.dim, units) : v);
		else out[f.name] = v;
	}
	return out;
}

/** Stored canonical values → what the form shows in `units`, rounded to what a person would type. */
export function toForm(
	fields: Field[],
	stored: Record<string, unknown>,
	units: Units
): SheetValues {
	const out: SheetValues = { units };
	for (const f of fields) {
		const v = stored[f.name];
		if (v === null || v === undefined) continue;
		if (typeof v === 'number' && f.dim)
			out[f.name] = Number(toShown(v, f.dim, units).toFixed(PLACES[f.dim][units]));
		else out[f.name] = v as string | number | boolean;
	}
	return out;
}

/** What must still be filled in before publishing: labels of the missing or wrong fields. */
export function missingFor(
	name: string,
	fields: Field[],
	stored: Record<string, unknown>
): string[] {
	const r = schemaFor(name, fields, 'metric', 'complete').safeParse(
		toForm(fields, stored, 'metric')
	);
	if (r.success) return [];
	const names = new Set(r.error.issues.map((i) => String(i.path[0])));
	return fields.filter((f) => names.has(f.name)).map((f) => f.label);
}
