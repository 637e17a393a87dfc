import type { ParamMatcher } from '@sveltejs/kit';

/**
 * A row id in a path: a positive whole number that fits a JavaScript number exactly. Anything
 * else is not a route at all (404), so handlers read `Number(params.id)` without checking it.
 */
export const match = ((param: string): param is string =>
	/^[1-9][0-9]{0,14}$/.test(param)) satisfies ParamMatcher;
