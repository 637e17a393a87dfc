import { fail } from '@sveltejs/kit';
import { message, setError, type SuperValidated } from 'sveltekit-superforms';
import { Failure } from '../../failure';

/** What the server holds now, in the form's units, and the version to save over it with. */
export type ServerCopy = { values: Record<string, unknown>; version: number };

export const CONFLICT =
	'Someone saved this sheet after you opened it (another tab or device). Your changes are still in the form: copy what you need, reload to see the saved version, and save again.';

/**
 * A service's `Failure` as a form action's answer, in one place: each field at fault gets its
 * words beside it, a stale save gets the conflict note, anything else shows above the form —
 * with what was typed kept. Anything that is not a `Failure` is rethrown.
 */
export function formFailure<T extends Record<string, unknown>>(
	form: SuperValidated<T>,
	e: unknown,
	current?: ServerCopy
) {
	if (!(e instanceof Failure)) throw e;
	// A stale save also carries what the server holds now, so a change sent later from the page's
	// send queue can be shown beside it and the member can choose.
	if (e.status === 409 && current) {
		form.message = CONFLICT as never;
		return fail(409, { form, current });
	}
	const fields = e.issues.filter((i) => i.path && i.path in (form.data as object));
	if (fields.length) {
		for (const i of fields.slice(1)) setError(form, i.path as never, i.message);
		return setError(form, fields[0].path as never, fields[0].message, {
			status: e.status as 400
		});
	}
	return message(form, e.status === 409 ? CONFLICT : e.message, { status: e.status as 400 });
}

/**
 * For actions without a superform (uploads, buttons): `fail(status, { [key]: words, ...keep })`,
 * so the page names the problem where it happened and keeps what was typed.
 */
export function plainFailure(e: unknown, key: string, keep: Record<string, unknown> = {}) {
	if (!(e instanceof Failure)) throw e;
	return fail(e.status, { [key]: e.message, ...keep });
}
