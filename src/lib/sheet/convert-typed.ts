// Switching units on a half-filled form: each typed number of a field with a dimension is carried
// into the other system at the precision that system shows; everything else stays as typed.
import type { Field } from './fields';
import { PLACES, toCanonical, toShown, type Units } from './units';

type Typed = { name: string; value: string | boolean };

export function convertTyped(fields: Field[], values: Typed[], from: Units, to: Units): Typed[] {
	if (from === to) return values;
	const dims = new Map(fields.filter((f) => f.dim).map((f) => [f.name, f.dim!]));
	return values.map((v) => {
		const dim = dims.get(v.name);
		if (!dim || typeof v.value !== 'string' || v.value.trim() === '') return v;
		const x = Number(v.value);
		if (!Number.isFinite(x)) return v; // not a number yet: left for the form to point out
		const shown = toShown(toCanonical(x, dim, from), dim, to);
		return { name: v.name, value: String(Number(shown.toFixed(PLACES[dim][to]))) };
	});
}
