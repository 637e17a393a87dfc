import { z } from 'zod';

/** How many builds or setups fit side by side. */
export const SIDE_BY_SIDE_MAX = 4;

/** "3,17,42" → distinct positive whole numbers; anything else is dropped. */
export function parseIds(s: string | undefined): number[] {
	return [
		...new Set(
			(s ?? '')
				.split(',')
				.map((x) => Number(x.trim()))
				.filter((n) => Number.isInteger(n) && n > 0)
		)
	];
}

/** The first four ids of a list (the page says how many more were left out). */
export const idList = z
	.string()
	.optional()
	.transform((s) => parseIds(s).slice(0, SIDE_BY_SIDE_MAX));

export const sideBySideQuerySchema = z.object({ builds: idList, setups: idList });
