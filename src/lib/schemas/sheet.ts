import { z } from 'zod';

// Hand-written JSON bodies around a build sheet. The sheet's own fields get their schemas from
// the field tables (src/lib/sheet/schema.ts), so forms and JSON share one definition.

/** The version a change is made against (optimistic locking: a stale one answers 409). */
export const versionSchema = z.object({ version: z.number().int().min(0) });

export const photoPatchSchema = z.object({
	caption: z.string().trim().max(300).optional(),
	setupId: z.number().int().positive().nullable().optional()
});

export const photoOrderSchema = z.object({ ids: z.array(z.number().int().positive()).max(50) });
