import { z } from 'zod';

/** "3,17,42" → [3, 17, 42]: at most four distinct positive whole numbers; anything else is dropped. */
export const idList = z
	.string()
	.optional()
	.transform((s) =>
		[
			...new Set(
				(s ?? '')
					.split(',')
					.map((x) => Number(x.trim()))
					.filter((n) => Number.isInteger(n) && n > 0)
			)
		].slice(0, 4)
	);

export const sideBySideQuerySchema = z.object({ builds: idList, setups: idList });
