import type { PageServerLoad } from './$types';

// Where Auth.js sends people when a sign-in link or callback fails.
const MESSAGES: Record<string, { title: string; body: string }> = {
	Verification: {
		title: 'That sign-in link no longer works',
		body: 'Each link works once and for 24 hours. This one was used already or has expired. Ask for a new one below.'
	},
	AccessDenied: {
		title: 'This account cannot sign in',
		body: 'The account is suspended. Write to the moderators if you think this is a mistake.'
	}
};
const FALLBACK = {
	title: 'Sign-in did not go through',
	body: 'Something went wrong while signing you in. Nothing was changed; please try again.'
};

export const load: PageServerLoad = async ({ url }) => {
	const code = url.searchParams.get('error') ?? '';
	return { code, ...(MESSAGES[code] ?? FALLBACK) };
};
