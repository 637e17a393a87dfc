import type { z } from 'zod';

// For pages with many small forms (a reply box under every comment, a decision form on every
// desk case): superforms wants one form object per form, so these parse FormData with the same
// zod schemas directly and hand back what was typed, so nothing is lost on an error.

export type Parsed<T> =
	| { ok: true; data: T; values: Record<string, string> }
	| { ok: false; values: Record<string, string>; message: string };

export async function parseForm<S extends z.ZodType>(
	request: Request,
	schema: S
): Promise<Parsed<z.output<S>>> {
	const fd = await request.formData();
	const values: Record<string, string> = {};
	for (const [k, v] of fd) if (typeof v === 'string') values[k] = v;
	const r = schema.safeParse(values);
	if (r.success) return { ok: true, data: r.data, values };
	return { ok: false, values, message: r.error.issues.map((i) => i.message).join(' ') };
}
