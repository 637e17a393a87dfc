import { z } from 'zod';

const opt = (min: number, max: number) =>
	z.coerce.number().min(min).max(max).optional().catch(undefined);

/** The base-scooter form (all optional but the cycle), shared by the page and GET /api/builds/close. */
export const closeQuerySchema = z.object({
	build: z.coerce.number().int().positive().optional().catch(undefined),
	cycle: z.enum(['two-stroke', 'four-stroke']).default('two-stroke'),
	cc: opt(30, 200),
	exhaust: z.enum(['stock', 'sport', 'expansion-chamber']).optional().catch(undefined),
	carb: opt(10, 40),
	tyre: z.string().trim().max(40).optional(),
	driver: z.coerce.number().int().min(8).max(80).optional().catch(undefined),
	driven: z.coerce.number().int().min(8).max(80).optional().catch(undefined),
	driver2: z.coerce.number().int().min(8).max(80).optional().catch(undefined),
	driven2: z.coerce.number().int().min(8).max(80).optional().catch(undefined),
	ratio: opt(2, 30),
	rollers: opt(6, 120),
	elevation: opt(-450, 5500),
	all: z.enum(['1', '0']).optional().catch(undefined),
	limit: z.coerce.number().int().min(1).max(50).default(10).catch(10),
	// "What would I get": the planned setup's peak rpm and top CVT ratio.
	peak: opt(3000, 16000),
	topCvt: opt(0.6, 1.5)
});

export type CloseQuery = z.infer<typeof closeQuerySchema>;
