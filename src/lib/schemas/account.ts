import { z } from 'zod';
import { THEMES } from '../theme';

export const PASSWORD_MIN = 10;

const email = z.email({ error: 'Enter an e-mail address like name@example.org.' }).trim().max(254);
const password = z
	.string()
	.min(PASSWORD_MIN, { error: `Use at least ${PASSWORD_MIN} characters.` })
	.max(200, { error: 'That is longer than we accept (200 characters).' });

export const passwordSignInSchema = z.object({
	email,
	password: z.string().min(1, { error: 'Enter your password.' }).max(200),
	next: z.string().optional()
});

export const linkSignInSchema = z.object({ email, next: z.string().optional() });

export const signUpSchema = z
	.object({
		name: z.string().trim().min(2, { error: 'Give a name of at least 2 characters.' }).max(80),
		email,
		password,
		confirm: z.string(),
		terms: z.literal(true, { error: 'Please accept the terms of use.' })
	})
	.refine((v) => v.password === v.confirm, {
		path: ['confirm'],
		error: 'The two passwords differ.'
	});

export const resetRequestSchema = z.object({ email });

export const newPasswordSchema = z
	.object({ password, confirm: z.string() })
	.refine((v) => v.password === v.confirm, {
		path: ['confirm'],
		error: 'The two passwords differ.'
	});

export const profileSchema = z.object({
	name: z.string().trim().min(2, { error: 'Give a name of at least 2 characters.' }).max(80),
	units: z.enum(['metric', 'imperial']),
	theme: z.enum(THEMES).default('device'),
	mailComments: z.boolean().default(false),
	mailShop: z.boolean().default(false)
});

/** Changing the password from the profile: the current one (when there is one), the new one twice. */
export const changePasswordSchema = z
	.object({ current: z.string().max(200).default(''), password, confirm: z.string() })
	.refine((v) => v.password === v.confirm, {
		path: ['confirm'],
		error: 'The two passwords differ.'
	});

const HOME = 'http://squishline.invalid';

/**
 * Only same-site paths: a `next` pointing elsewhere would make sign-in an open redirect. Parsed
 * the way a browser parses a Location header (tabs and newlines dropped, `\` read as `/`), so
 * `/\evil.example` and `/<tab>/evil.example` are seen as the other host they are.
 */
export function safeNext(next: string | null | undefined): string {
	if (!next || !next.startsWith('/')) return '/';
	let url: URL;
	try {
		url = new URL(next, HOME);
	} catch {
		return '/';
	}
	return url.origin === HOME ? url.pathname + url.search + url.hash : '/';
}
