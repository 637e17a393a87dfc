import { z } from 'zod';

export const deskNoteSchema = z.object({
	body: z
		.string()
		.trim()
		.min(3, { error: 'Write at least a few words.' })
		.max(1000, { error: 'Keep desk notes under 1,000 characters.' })
});
