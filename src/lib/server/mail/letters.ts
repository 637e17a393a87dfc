// The mail templates for notifications and desk decisions, each with a plain-text part (see
// compose in mail.ts). Account mails (confirm, reset, sign-in link) live with the accounts code.
import { LOG_LABEL } from '../../review/kinds';
import { untilText, type Suspension } from '../../review/suspension';
import { env } from '../env';
import { compose, type Letter } from './send';

const link = (path: string) => new URL(path, env().ORIGIN).toString();
const clip = (s: string, n = 240) => {
	const flat = s.replace(/\s+/g, ' ').trim();
	return flat.length > n ? `${flat.slice(0, n - 1)}…` : flat;
};

export type DigestComment = {
	id: number;
	author: string;
	setupLabel: string | null;
	body: string;
};

export function commentDigest(opts: {
	to: string;
	buildId: number;
	buildTitle: string;
	comments: DigestComment[];
	unsubscribeUrl: string;
}): Letter {
	const n = opts.comments.length;
	return compose({
		to: opts.to,
		subject:
			n === 1
				? `A new comment on “${opts.buildTitle}”`
				: `${n} new comments on “${opts.buildTitle}”`,
		paragraphs: [
			n === 1
				? `Someone commented on your build “${opts.buildTitle}”:`
				: `${n} comments came in on your build “${opts.buildTitle}” in the last hour:`,
			...opts.comments.map(
				(c) => `${c.author}${c.setupLabel ? ` (on ${c.setupLabel})` : ''}: ${clip(c.body)}`
			)
		],
		action: { label: 'Read and reply', url: link(`/builds/${opts.buildId}#comments`) },
		footer: 'We collect comments for an hour and send them together, one mail per build at most.',
		unsubscribeUrl: opts.unsubscribeUrl
	});
}

const DECISION_TEXT: Record<string, (item: string) => string> = {
	dismiss: (item) => `The review desk looked at reports about your ${item} and left it as it is.`,
	triage: (item) =>
		`The review desk is looking at your ${item}: readers now see a note that it is under review for safety. You can still edit it.`,
	hide: (item) =>
		`The review desk took down your ${item}. Readers see the reason below in its place; the content is kept, and you can still see and edit it.`,
	restore: (item) => `The review desk put your ${item} back. Readers see it as before.`,
	warn: () => 'The review desk is warning you about something you posted.'
};

/** One decision of the desk, mailed to the item's author with its reason. */
export function deskDecision(opts: {
	to: string;
	action: string;
	itemLabel: string;
	itemTitle: string;
	itemUrl: string;
	reason: string;
	canAskAgain: boolean;
}): Letter {
	const intro = (DECISION_TEXT[opts.action] ?? DECISION_TEXT.warn)(opts.itemLabel);
	return compose({
		to: opts.to,
		subject: `Review desk: ${LOG_LABEL[opts.action] ?? opts.action} — ${opts.itemTitle}`,
		paragraphs: [
			intro,
			`Item: ${opts.itemTitle}`,
			...(opts.reason ? [`Reason: ${opts.reason}`] : []),
			...(opts.canAskAgain
				? [
						'If you change it, you can ask for another look once, from the item itself: the desk will then decide again.'
					]
				: [])
		],
		action: { label: 'Open the item', url: link(opts.itemUrl) },
		footer:
			'Every decision of the review desk is logged. Reply to desk@squishline.test with questions.'
	});
}

export function suspensionNotice(opts: { to: string; suspension: Suspension }): Letter {
	return compose({
		to: opts.to,
		subject: 'Review desk: your account is suspended',
		paragraphs: [
			`Your Squishline account is suspended ${untilText(opts.suspension)}.`,
			`Reason: ${opts.suspension.reason}`,
			'Meanwhile you can sign in, read and export your sheets, but not post, comment, report or message. Access comes back on its own when the period ends.'
		],
		footer:
			'Every decision of the review desk is logged. Reply to desk@squishline.test with questions.'
	});
}
