// The moderation vocabulary shared by the server, the forms and the pages.

export const ITEM_TYPES = ['build', 'setup', 'comment', 'shop'] as const;
export type ItemType = (typeof ITEM_TYPES)[number];

export const ITEM_LABEL: Record<ItemType, string> = {
	build: 'build sheet',
	setup: 'setup',
	comment: 'comment',
	shop: 'shop page'
};

export const REPORT_REASONS = ['unsafe', 'wrong-data', 'spam', 'abuse', 'other'] as const;
export type ReportReason = (typeof REPORT_REASONS)[number];

export const REASON_LABEL: Record<ReportReason, string> = {
	unsafe: 'Unsafe advice',
	'wrong-data': 'Wrong or made-up figures',
	spam: 'Spam or advertising',
	abuse: 'Abuse or harassment',
	other: 'Something else'
};

/** What the desk can do with an item or its author; every one is written to the log. */
export const DESK_ACTIONS = ['dismiss', 'triage', 'hide', 'restore', 'warn', 'suspend'] as const;
export type DeskAction = (typeof DESK_ACTIONS)[number];

/** Log actions: the desk's, the author's request for another look, and admin steps. */
export const LOG_LABEL: Record<string, string> = {
	dismiss: 'Dismissed',
	triage: 'Triaged as a concern',
	hide: 'Taken down',
	restore: 'Put back',
	warn: 'Warned the author',
	suspend: 'Suspended the author',
	'second-look': 'Author asked for another look',
	'lift-suspension': 'Lifted a suspension',
	'change-role': 'Changed a role',
	'end-sessions': 'Signed an account out everywhere',
	'verify-shop': 'Verified a shop',
	'unverify-shop': 'Withdrew a shop’s verification',
	'link-request': 'Shop asked to be named on a build',
	'link-approve': 'Owner approved a shop link',
	'link-decline': 'Owner declined a shop link',
	'link-remove': 'Owner removed a shop link',
	'handover-offer': 'Shop offered a build to a customer',
	'handover-withdraw': 'Shop withdrew a build offer',
	'handover-accept': 'Customer took over a build',
	'staff-invite': 'Shop invited staff',
	'staff-remove': 'Shop removed staff',
	'account-delete': 'Member deleted their account',
	'scooter-accept': 'Accepted a scooter into the catalogue',
	'scooter-decline': 'Declined a proposed scooter'
};

/** Unsafe reports from this many different members put the caution banner up on their own. */
export const UNSAFE_REPORTS_FOR_CAUTION = 3;

export const COMMENT_MAX = 4000;
export const REPORT_NOTE_MAX = 1000;
export const REASON_MAX = 300;
