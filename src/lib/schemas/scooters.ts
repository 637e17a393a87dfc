import { z } from 'zod';

/** `/scooters` and `GET /api/scooters`: a typed name to find, typos forgiven. */
export const scooterQuerySchema = z.object({ q: z.string().trim().max(80).optional() });

/** A scooter's builds, a page at a time: `before` is the last build id of the page before. */
export const scooterPageSchema = z.object({
	before: z.coerce.number().int().positive().optional()
});

/** The catalogue's scooter a new build starts from: an id, or nothing (empty in a form). */
export const startFromSchema = z.object({
	baseScooterId: z.preprocess(
		(v) => (v === '' || v === undefined ? null : v),
		z.coerce.number().int().positive().nullable()
	)
});
