// Argument checks shared by the tuning functions: each throws a RangeError whose message starts
// with the parameter's name, never letting a NaN or an impossible value through.

export function finite(name: string, v: number): number {
	if (typeof v !== 'number' || !Number.isFinite(v)) {
		throw new RangeError(`${name} must be a finite number (got ${String(v)})`);
	}
	return v;
}

export function positive(name: string, v: number): number {
	finite(name, v);
	if (v <= 0) throw new RangeError(`${name} must be greater than 0 (got ${v})`);
	return v;
}

export function nonNegative(name: string, v: number): number {
	finite(name, v);
	if (v < 0) throw new RangeError(`${name} must not be negative (got ${v})`);
	return v;
}

export function between(name: string, v: number, min: number, max: number): number {
	finite(name, v);
	if (v < min || v > max)
		throw new RangeError(`${name} must be between ${min} and ${max} (got ${v})`);
	return v;
}

/** Strictly inside (min, max). */
export function inside(name: string, v: number, min: number, max: number): number {
	finite(name, v);
	if (v <= min || v >= max)
		throw new RangeError(`${name} must be more than ${min} and less than ${max} (got ${v})`);
	return v;
}
