import { z } from 'zod';
import { ROLES } from '../roles';

const id = z.coerce.number().int().positive();
const text = (max: number, what: string) =>
	z.string().trim().max(max, `Keep the ${what} under ${max} characters.`);
const email = z.string().trim().toLowerCase().email('That does not look like an e-mail address.');

export const SHOP_MESSAGE_MAX = 2000;

/** A shop page's own words; a region, never a street address. */
export const shopSchema = z.object({
	name: text(120, 'name').min(2, 'Give the shop a name.'),
	region: text(120, 'region'),
	services: text(2000, 'services').min(1, 'Say what the shop does.'),
	openingNote: text(500, 'opening note')
});

export const staffInviteSchema = z.object({ email });
export const staffRemoveSchema = z.object({ staffId: id });

export const LINK_KINDS = ['built', 'tuned'] as const;
export const linkRequestSchema = z.object({
	buildId: id,
	kind: z.enum(LINK_KINDS, { error: 'Say whether the shop built or tuned it.' }),
	note: text(500, 'note').default('')
});
export const linkRefSchema = z.object({ linkId: id });

const chosenSheet = z.coerce
	.number({ error: 'Choose the sheet to hand over.' })
	.int()
	.positive('Choose the sheet to hand over.');
export const transferSchema = z.object({ buildId: chosenSheet, email });
export const transferRefSchema = z.object({ transferId: id });

export const messageSchema = z.object({
	body: text(SHOP_MESSAGE_MAX, 'message').min(1, 'Write your message first.')
});
export const replySchema = z.object({
	messageId: id,
	reply: text(SHOP_MESSAGE_MAX, 'reply').min(1, 'Write the reply first.')
});

export const DELETE_MODES = ['delete-builds', 'keep-anonymised'] as const;
export const accountDeleteSchema = z.object({
	mode: z.enum(DELETE_MODES, { error: 'Choose what happens to your builds.' }),
	confirm: z.literal('delete my account', {
		error: 'Type “delete my account” to confirm.'
	})
});

export const roleChangeSchema = z.object({ userId: z.string().uuid(), role: z.enum(ROLES) });
export const adminSuspendSchema = z.object({
	userId: z.string().uuid(),
	reason: text(300, 'reason').min(1, 'Say why: the member is told.'),
	days: z.coerce.number().int().min(0).max(365)
});
export const userRefSchema = z.object({ userId: z.string().uuid() });
export const shopRefSchema = z.object({ shopId: id });

/** The owner's answer to a shop asking to be named on their build. */
export const linkDecisionSchema = linkRefSchema.extend({
	decision: z.enum(['approve', 'decline'])
});

/** An admin's check of a shop, with an optional note for the log. */
export const shopCheckSchema = shopRefSchema.extend({
	note: z.string().trim().max(300).default('')
});
