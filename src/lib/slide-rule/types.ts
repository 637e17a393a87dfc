import { fixed } from '../intl';
import type { SpeedWarning } from '../tuning';

export type Units = 'metric' | 'imperial';

/** One line of a calculator's answer; `value` is unrounded, `decimals` is how the page shows it. */
export type ResultRow = {
	key: string;
	label: string;
	value: number;
	unit: string;
	decimals: number;
	note?: string;
	/** A change: shown with its sign (+ or −) even when positive. */
	signed?: boolean;
	/** Working, not the answer: left off the printed sheet. */
	detail?: boolean;
};

/** A row's value as printed: fixed decimals, a real minus sign, and a plus on a positive change. */
export function formatResult(r: ResultRow): string {
	const zero = Number(Math.abs(r.value).toFixed(r.decimals)) === 0;
	const text = fixed(Math.abs(r.value), r.decimals);
	if (r.value < 0 && !zero) return `\u2212${text}`;
	return r.signed && !zero ? `+${text}` : text;
}

export type CalcResult = { rows: ResultRow[]; warnings: SpeedWarning[]; notes: string[] };

export type Issue = { path: string; message: string };

export type CalcOutcome = { ok: true; result: CalcResult } | { ok: false; issues: Issue[] };

/** An input problem the schema cannot see (e.g. a port roof below the stroke); `path` names the field. */
export class FieldError extends Error {
	constructor(
		readonly path: string,
		message: string
	) {
		super(message);
	}
}

/** Runs a tuning call, turning its RangeError into a FieldError on the field the user typed. */
export function on<T>(path: string, fn: () => T): T {
	try {
		return fn();
	} catch (e) {
		if (e instanceof RangeError)
			throw new FieldError(path, e.message.replace(/^\S+\s/, 'This value '));
		throw e;
	}
}

export const row = (
	key: string,
	label: string,
	value: number,
	unit: string,
	decimals: number,
	note?: string
): ResultRow => ({
	key,
	label,
	value,
	unit,
	decimals,
	...(note ? { note } : {})
});

/** A row that is a change from one state to another, printed with its sign. */
export const changeRow = (
	key: string,
	label: string,
	value: number,
	unit: string,
	decimals: number
): ResultRow => ({ ...row(key, label, value, unit, decimals), signed: true });

/** Checks a typed value against a range given in the reader's own units, naming the field. */
export function within(path: string, value: number, lo: number, hi: number, unit: string): number {
	if (value < lo || value > hi) {
		const u = unit ? ` ${unit}` : '';
		throw new FieldError(path, `Must be between ${fmt(lo)} and ${fmt(hi)}${u}.`);
	}
	return value;
}

/** A number as a message prints it: a real minus sign, thousands grouped, no float dust. */
export const fmt = (v: number, decimals?: number): string => {
	const s = (decimals === undefined ? Number(v.toPrecision(6)) : v).toLocaleString('en-GB', {
		maximumFractionDigits: decimals ?? 4,
		minimumFractionDigits: decimals ?? 0
	});
	return s.replace('-', '\u2212');
};
