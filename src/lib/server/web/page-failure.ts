import { error } from '@sveltejs/kit';
import { Failure } from '../../failure';

/** A service's `Failure` as the page's error (its status and words), like the guard's own. */
export function pageFailure(e: unknown): never {
	if (e instanceof Failure) error(e.status, { message: e.message, issues: e.issues });
	throw e;
}

/**
 * A load or action whose refusals show as the error page: the one mapping for pages, beside
 * `api()` for JSON and `formFailure` where a form shows the words beside its fields.
 */
export function forPage<E, R>(fn: (event: E) => Promise<R>): (event: E) => Promise<R> {
	return async (event) => {
		try {
			return await fn(event);
		} catch (e) {
			return pageFailure(e);
		}
	};
}

/** `forPage` for every action of a page. */
export function forPages<A extends object>(actions: A): A {
	return Object.fromEntries(
		Object.entries(actions).map(([name, fn]) => [
			name,
			forPage(fn as (event: unknown) => Promise<unknown>)
		])
	) as A;
}
