import type { PageServerLoad } from './$types';

// Where Auth.js sends people when a sign-in link or callback fails.
const MESSAGES: Record<string, { title: string; body: string }> = {
	Verification: {
		title: 'That sign-in link no longer works',
		body: 'Each link works once and for 24 hours. This one was used already or has expired. Ask for a new one below.'
	},
	AccessDenied: {
		title: 'This sign-in was refused',
		body: 'The sign-in did not go through. Nothing was changed; ask for a new link below.'
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
