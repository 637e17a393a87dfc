import { z } from 'zod';
import { CURRENCIES, EXHAUST_TYPES } from '../sheet/fields';

// The public builds list's filters, sort and page, shared by /builds and GET /api/builds. Numbers are
// in the reader's units (speed in km/h or mph, elevation in m or ft); the server converts.
const num = (min: number, max: number) =>
	z
		.preprocess(
			(v) => (v === '' || v === null ? undefined : v),
			z.coerce.number().min(min).max(max).optional()
		)
		.catch(undefined);

export const buildListSchema = z.object({
	q: z.string().trim().max(80).optional().catch(undefined),
	cycle: z.enum(['two-stroke', 'four-stroke']).optional().catch(undefined),
	family: z.string().trim().max(120).optional().catch(undefined),
	exhaust: z
		.enum(EXHAUST_TYPES.map((o) => o.value) as [string, ...string[]])
		.optional()
		.catch(undefined),
	ccMin: num(0, 400),
	ccMax: num(0, 400),
	speedMin: num(0, 400),
	speedMax: num(0, 400),
	elevMin: num(-1500, 20000),
	elevMax: num(-1500, 20000),
	photos: z.enum(['1']).optional().catch(undefined),
	runs: z.enum(['0', '1']).optional().catch(undefined),
	sort: z.enum(['newest', 'fastest', 'cheapest']).default('newest').catch('newest'),
	/** The currency a cost order is read in (costs are never converted); the reader's by default. */
	currency: z
		.enum(CURRENCIES.map((o) => o.value) as [string, ...string[]])
		.optional()
		.catch(undefined),
	view: z.enum(['cards', 'table']).default('cards').catch('cards'),
	cursor: z.string().max(200).optional().catch(undefined),
	limit: z.coerce.number().int().min(1).max(100).default(24).catch(24)
});
export type BuildListQuery = z.infer<typeof buildListSchema>;
