import { formatField } from './format';
import { SETUP_FIELDS } from './setup-fields';
import type { Units } from './units';

export type Change = { field: string; label: string; from: string; to: string };

/** What changed between two consecutive setups, field by field, in the reader's units. */
export function diffSetups(
	prev: Record<string, unknown>,
	next: Record<string, unknown>,
	units: Units
): Change[] {
	const out: Change[] = [];
	for (const f of SETUP_FIELDS) {
		if (f.name === 'changeNote' || f.name === 'isStock') continue;
		const a = prev[f.name] ?? null;
		const b = next[f.name] ?? null;
		const equal =
			typeof a === 'number' && typeof b === 'number'
				? Math.abs(a - b) < 1e-9
				: a === b || (a === '' && b === null) || (a === null && b === '');
		if (!equal)
			out.push({
				field: f.name,
				label: f.label,
				from: formatField(f, a, units),
				to: formatField(f, b, units)
			});
	}
	return out;
}
