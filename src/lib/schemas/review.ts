import { z } from 'zod';
import {
	COMMENT_MAX,
	DESK_ACTIONS,
	ITEM_TYPES,
	REASON_MAX,
	REPORT_NOTE_MAX,
	REPORT_REASONS,
	type ReportReason
} from '../review/kinds';

const id = z.coerce.number().int().positive();
const optionalId = z.preprocess((v) => (v === '' || v === null ? undefined : v), id.optional());

const body = z
	.string()
	.trim()
	.min(1, 'Write something first.')
	.max(COMMENT_MAX, `Keep it under ${COMMENT_MAX} characters.`);

/** A new comment or reply; the same schema serves the build page's form and the JSON route. */
export const commentSchema = z.object({
	body,
	setupId: optionalId,
	parentId: optionalId
});

export const commentEditSchema = z.object({ commentId: id, body });
export const commentRefSchema = z.object({ commentId: id });

export const itemRefSchema = z.object({
	itemType: z.enum(ITEM_TYPES),
	itemId: id
});

export const reportSchema = itemRefSchema.extend({
	// No default: a form that starts with a reason chosen files it on one careless tap.
	reason: z
		.enum(['', ...REPORT_REASONS], { error: 'Pick what is wrong with it.' })
		.default('')
		.refine((r) => r !== '', 'Pick what is wrong with it.')
		.transform((r) => r as ReportReason),
	note: z
		.string()
		.trim()
		.max(REPORT_NOTE_MAX, `Keep the note under ${REPORT_NOTE_MAX} characters.`)
		.default('')
});

export const deskActionSchema = z.object({
	caseId: id,
	action: z.enum(DESK_ACTIONS),
	reason: z
		.string()
		.trim()
		.max(REASON_MAX, `Keep the reason under ${REASON_MAX} characters.`)
		.default(''),
	// 0 = until lifted; otherwise 1 to 365 days.
	days: z.coerce.number().int().min(0).max(365).default(7)
});

/** Putting back an item the desk took down: always with the reason, logged and mailed. */
export const putBackSchema = z.object({
	reason: z
		.string()
		.trim()
		.min(1, 'Say why it goes back up: the reason is logged and mailed to the author.')
		.max(REASON_MAX, `Keep the reason under ${REASON_MAX} characters.`)
});
