// No zod here: this module is in every page's scripts (the side-by-side tray).

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
