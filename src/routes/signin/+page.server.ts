import { fail, isRedirect, redirect } from '@sveltejs/kit';
import { CredentialsSignin } from '@auth/sveltekit';
import { message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { signIn } from '$lib/server/auth';
import { mailRequests, take } from '$lib/server/auth/limits';
import { linkSignInSchema, passwordSignInSchema, safeNext } from '$lib/schemas/account';
import type { Actions, PageServerLoad } from './$types';

const REASONS: Record<string, string> = {
	credentials: 'That e-mail and password do not match an account.',
	unverified:
		'Confirm your e-mail address first: use the link in the mail we sent when you joined.',
	'rate-limited':
		'Too many wrong passwords for this account. Wait 15 minutes, or reset the password by mail.',
	'address-limited':
		'Too many sign-in attempts from your network. Wait 15 minutes, or reset your password by mail.'
};

export const load: PageServerLoad = async ({ locals, url }) => {
	const next = safeNext(url.searchParams.get('next'));
	if (locals.user) redirect(303, next);
	const [password, link] = await Promise.all([
		superValidate({ next }, zod4(passwordSignInSchema), { errors: false }),
		superValidate({ next }, zod4(linkSignInSchema), { errors: false })
	]);
	return {
		password,
		link,
		reset: url.searchParams.has('reset'),
		ended: url.searchParams.has('ended'),
		passwordChanged: url.searchParams.has('password-changed'),
		verified: url.searchParams.has('verified')
	};
};

/** Hands validated fields to Auth.js as the form body it expects. */
function authEvent<E extends { request: Request }>(event: E, fields: Record<string, string>): E {
	const headers = new Headers(event.request.headers);
	headers.delete('content-type');
	headers.delete('content-length');
	const body = new FormData();
	for (const [k, v] of Object.entries(fields)) body.set(k, v);
	return { ...event, request: new Request(event.request.url, { method: 'POST', headers, body }) };
}

export const actions: Actions = {
	password: async (event) => {
		const form = await superValidate(event.request, zod4(passwordSignInSchema));
		const password = form.data.password;
		form.data.password = ''; // never echo a password back into the page
		if (!form.valid) return fail(400, { password: form });
		try {
			await signIn(
				authEvent(event, {
					providerId: 'password',
					email: form.data.email,
					password,
					redirectTo: safeNext(form.data.next)
				})
			);
		} catch (e) {
			if (isRedirect(e)) throw e;
			if (e instanceof CredentialsSignin) {
				const limited = e.code === 'rate-limited' || e.code === 'address-limited';
				return message(form, REASONS[e.code] ?? REASONS.credentials, {
					status: limited ? 429 : 400
				});
			}
			throw e;
		}
		redirect(303, safeNext(form.data.next));
	},
	link: async (event) => {
		const form = await superValidate(event.request, zod4(linkSignInSchema));
		if (!form.valid) return fail(400, { link: form });
		if (!(await take(mailRequests, `link:${form.data.email.toLowerCase()}`))) {
			return message(form, 'We have sent several links to this address already; wait an hour.', {
				status: 429
			});
		}
		try {
			await signIn(
				authEvent(event, {
					providerId: 'link',
					email: form.data.email,
					redirectTo: safeNext(form.data.next)
				})
			);
		} catch (e) {
			if (isRedirect(e)) throw e;
			console.error('[sign-in link]', e);
			return message(form, 'We could not send the mail just now. Try again in a few minutes.', {
				status: 503
			});
		}
		redirect(303, '/signin/check-mail');
	}
};
