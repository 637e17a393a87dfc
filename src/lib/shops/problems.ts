// Why a mailed link was refused, in words for the page that says so. Shared by server and pages.
export type TokenProblem = 'forged' | 'expired' | 'used';

/** What a refused link page says, in our words. */
export const PROBLEM_TEXT: Record<TokenProblem, { title: string; body: string }> = {
	forged: {
		title: 'This link is not one of ours',
		body: 'It may have been cut short when it was copied. Nothing was changed. Open the mail again and use the whole link, or do the same from the build page.'
	},
	expired: {
		title: 'This link has run out',
		body: 'Links in these mails work for 24 hours. Nothing was changed. You can still do the same from the build page while signed in.'
	},
	used: {
		title: 'This link has already been used',
		body: 'The step it was for is already decided, so nothing was changed. The build page shows where things stand.'
	}
};
