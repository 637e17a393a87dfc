// Mails for the shop steps; each has a plain-text part (compose in mail.ts).
import { env } from '../env';
import { compose, type Letter } from '../mail/send';

const link = (path: string) => new URL(path, env().ORIGIN).toString();

export function linkRequest(opts: {
	to: string;
	shopName: string;
	verified: boolean;
	buildId: number;
	buildTitle: string;
	kind: 'built' | 'tuned';
	note: string;
	token: { approve: string; decline: string };
}): Letter {
	return compose({
		to: opts.to,
		subject: `${opts.shopName} asks to be shown as having ${opts.kind} “${opts.buildTitle}”`,
		paragraphs: [
			`${opts.shopName}${opts.verified ? ' (a verified shop)' : ''} says it ${opts.kind} your build “${opts.buildTitle}” and asks to be named on it as “${opts.kind} by ${opts.shopName}”.`,
			...(opts.note ? [`Their note: ${opts.note}`] : []),
			'Nothing shows until you approve. You can remove the link from your build at any time.'
		],
		action: [
			{ label: 'Approve the link', url: link(`/links/${opts.token.approve}`) },
			{ label: 'Decline it', url: link(`/links/${opts.token.decline}`) }
		],
		footer: `These two links work once and for 24 hours. You can also decide on the build page: ${link(`/builds/${opts.buildId}#shops`)}`
	});
}

export function transferOffer(opts: {
	to: string;
	shopName: string;
	buildTitle: string;
	token: string;
}): Letter {
	return compose({
		to: opts.to,
		subject: `${opts.shopName} hands you the build sheet “${opts.buildTitle}”`,
		paragraphs: [
			`${opts.shopName} built up a build sheet for you, “${opts.buildTitle}”, and offers to move it to your Squishline account. Once you accept, it is yours: you can edit, publish or delete it, and the shop can no longer change it.`,
			'You need an account with this e-mail address; if you have none, sign up with it first and then open the link.'
		],
		action: { label: 'Accept the build sheet', url: link(`/handover/${opts.token}`) },
		footer:
			'The link works once and for 24 hours. Until you accept, the sheet stays a draft of the shop.'
	});
}

export function staffInvite(opts: { to: string; shopName: string; token: string }): Letter {
	return compose({
		to: opts.to,
		subject: `${opts.shopName} invites you to act for the shop on Squishline`,
		paragraphs: [
			`${opts.shopName} asks you to join its shop page as staff: you could ask owners to link builds, hand build sheets to customers and answer messages for the shop.`,
			'Sign in (or sign up) with this e-mail address, then open the link.'
		],
		action: { label: 'Join the shop', url: link(`/staff/${opts.token}`) },
		footer: 'The link works once and for 24 hours.'
	});
}

export function shopMessage(opts: {
	to: string;
	shopId: number;
	shopName: string;
	senderName: string;
	body: string;
}): Letter {
	return compose({
		to: opts.to,
		subject: `A message for ${opts.shopName} from ${opts.senderName}`,
		paragraphs: [
			`${opts.senderName} wrote to ${opts.shopName} through Squishline:`,
			opts.body,
			'Their e-mail address is shown to you once you reply through Squishline.'
		],
		action: { label: 'Reply', url: link(`/shop#messages`) },
		footer: 'Replying to this mail does not reach the sender; use the link above.'
	});
}

export function shopReply(opts: {
	to: string;
	shopId: number;
	shopName: string;
	original: string;
	reply: string;
	shopAddress: string;
}): Letter {
	return compose({
		to: opts.to,
		subject: `${opts.shopName} replied to your message`,
		paragraphs: [
			`${opts.shopName} replied:`,
			opts.reply,
			`You wrote: ${opts.original}`,
			`From now on you can write to each other directly: ${opts.shopAddress}. The shop can see your address too.`
		],
		action: { label: 'The shop page', url: link(`/shops/${opts.shopId}`) }
	});
}
