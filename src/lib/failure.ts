import type { z } from 'zod';

export type Issue = { path: string; message: string };

/**
 * The one way a service refuses: a status, words for the person, and the fields at fault. The
 * JSON API answers it as `{ error, issues }` (`api()` in server/api.ts) and form actions show it
 * beside the field or above the form (`formFailure` in server/web/form-failure.ts).
 */
export class Failure extends Error {
	constructor(
		readonly status: number,
		message: string,
		readonly issues: Issue[] = []
	) {
		super(message);
	}
}

/** A refusal of one field: its words shown beside it and as the message. */
export const fieldFailure = (status: number, path: string, message: string) =>
	new Failure(status, message, [{ path, message }]);

/** Checks a body against its schema; a misfit is a 422 naming each field. */
export function parse<S extends z.ZodType>(schema: S, body: unknown): z.infer<S> {
	const r = schema.safeParse(body);
	if (!r.success) {
		throw new Failure(
			422,
			'The body does not fit the schema.',
			r.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }))
		);
	}
	return r.data;
}
