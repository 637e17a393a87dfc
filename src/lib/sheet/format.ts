import { money } from '../intl';
import { RUN_METHODS, type Field } from './fields';
import { PLACES, show, type Units } from './units';

/** A stored (canonical) field value as a reader sees it. */
export function formatField(f: Field, v: unknown, units: Units): string {
	if (v === null || v === undefined || v === '') return '—';
	if (f.kind === 'checkbox') return v ? 'yes' : 'no';
	if (f.kind === 'select') return f.options?.find((o) => o.value === v)?.label ?? String(v);
	if (typeof v === 'number') {
		if (f.dim)
			return show(
				v,
				f.dim,
				units,
				f.dim === 'length' && units === 'metric' ? 2 : PLACES[f.dim][units]
			);
		const text = Number.isInteger(v) ? String(v) : String(Number(v.toFixed(3)));
		return f.unit && f.unit !== 'size' ? `${text} ${f.unit}` : text;
	}
	return String(v);
}

/** Money in minor units as "€ 129.90"-style text, via the platform's currency formatting. */
export function formatMoney(minor: number, currency: string): string {
	return money(minor, currency);
}

/** How a run was measured, in words ("phone GPS", never the stored code). */
export function methodLabel(m: string | null | undefined): string {
	return m ? (RUN_METHODS.find((o) => o.value === m)?.label ?? m) : '';
}
