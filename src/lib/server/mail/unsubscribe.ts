import { env } from '../env';
import { readToken, signToken } from './signed-links';

/** The kinds of notification mail a member can turn off, and the profile switch each one sets. */
export const TOPICS = {
	comments: { label: 'new comments on your builds', field: 'mailComments' },
	shop: { label: 'mail about shops and your builds', field: 'mailShop' }
} as const;
export type Topic = keyof typeof TOPICS;

/** A link that turns one kind of mail off for one member, without signing in. It does not expire. */
export function unsubscribeUrl(userId: string, topic: Topic): string {
	const token = signToken('unsubscribe', { u: userId, t: topic });
	return new URL(`/unsubscribe/${token}`, env().ORIGIN).toString();
}

export function readUnsubscribe(token: string): { userId: string; topic: Topic } | null {
	const p = readToken<{ u?: unknown; t?: unknown }>('unsubscribe', token);
	if (!p || typeof p.u !== 'string' || typeof p.t !== 'string' || !(p.t in TOPICS)) return null;
	return { userId: p.u, topic: p.t as Topic };
}
