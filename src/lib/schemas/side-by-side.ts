import { z } from 'zod';
import { parseIds, SIDE_BY_SIDE_MAX } from '../stats/pick';

/** The first four ids of a list (the page says how many more were left out). */
const idList = z
	.string()
	.optional()
	.transform((s) => parseIds(s).slice(0, SIDE_BY_SIDE_MAX));

export const sideBySideQuerySchema = z.object({ builds: idList, setups: idList });
