import * as tokens from '../auth/email-tokens';
import { checkPassword, hashPassword } from '../auth/password';
import { liftAccountLock } from '../auth/password-signin';
import { endAllSessions } from '../auth/sessions';
import { inTransaction } from '../db/transaction';
import * as users from '../auth/users';
import { env } from '../env';
import { linkLetter, send } from '../mail/send';

// Account flows that send mail. Answers never reveal whether an address has an account, and
// mail is queued (send), so the answer does not wait on the relay or show by its timing whether
// a mail went out.

const link = (path: string) => new URL(path, env().ORIGIN).toString();

export async function signUp(input: { name: string; email: string; password: string }) {
	return inTransaction(async () => {
		const existing = await users.readByEmail(input.email);
		if (existing) {
			// The same argon2 work as a new account, so the answer's timing does not tell them apart.
			await hashPassword(input.password);
			// Joined before but never confirmed (the mail was lost, or the relay was down): try again.
			if (!existing.emailVerified) return sendVerification(existing.id, existing.email);
			await send(
				linkLetter({
					to: existing.email,
					subject: 'Someone tried to join Squishline with your address',
					intro: 'This address already has a Squishline account, so no new one was made.',
					action: 'Sign in or reset your password',
					url: link('/signin'),
					outro: 'If that was not you, nothing has changed and you can ignore this mail.'
				})
			);
			return;
		}
		const user = await users.create({
			name: input.name,
			email: input.email,
			password: input.password
		});
		await sendVerification(user.id, user.email);
	});
}

/** "Send the confirmation again": a fresh link for an account that is not confirmed yet. */
export async function resendConfirmation(email: string) {
	return inTransaction(async () => {
		const user = await users.readByEmail(email);
		if (user && !user.emailVerified) await sendVerification(user.id, user.email);
	});
}

async function sendVerification(userId: string, email: string) {
	const token = await tokens.issue(userId, 'verify');
	await send(
		linkLetter({
			to: email,
			subject: 'Confirm your address for Squishline',
			intro: 'Welcome to Squishline. Confirm this address to finish opening your bench.',
			action: 'Confirm my address',
			url: link(`/verify/${token}`),
			outro: 'The link works once, for 48 hours. If you did not join, ignore this mail.'
		})
	);
}

export async function confirmAddress(token: string) {
	return inTransaction(async () => {
		const used = await tokens.consume(token, 'verify');
		if (used.ok) await users.markVerified(used.userId);
		return used;
	});
}

export async function requestReset(email: string) {
	return inTransaction(async () => {
		const user = await users.readByEmail(email);
		if (!user) return;
		const token = await tokens.issue(user.id, 'reset');
		await send(
			linkLetter({
				to: user.email,
				subject: 'Reset your Squishline password',
				intro: 'Someone (we hope you) asked to reset the password of this Squishline account.',
				action: 'Choose a new password',
				url: link(`/reset/${token}`),
				outro:
					'The link works once, for one hour. If you did not ask, your password stays as it was.'
			})
		);
	});
}

/**
 * One transaction: the link is spent, the password set, the address confirmed and every older
 * session ended together, or none of it (a half-done reset could leave a thief signed in).
 */
export async function resetPassword(token: string, password: string) {
	const used = await inTransaction(async (t) => {
		const used = await tokens.consume(token, 'reset', t);
		if (!used.ok) return used;
		await users.setPassword(used.userId, password, t);
		// Following the mailed link proves the address, as a verification link would.
		await users.markVerified(used.userId, t);
		// Whoever had the old password (or a session made with it) is out.
		await endAllSessions(used.userId, t);
		return used;
	});
	if (!used.ok) return used;
	// The owner is let back in.
	const user = await users.read(used.userId);
	if (user) await liftAccountLock(user.email);
	return used;
}

/**
 * A signed-in member changes their password, giving the current one (an account made by mailed
 * link has none yet and simply sets one). The new password and the end of every session, this one
 * too, happen together: whoever knew the old password is out.
 */
export async function changePassword(
	userId: string,
	current: string,
	next: string
): Promise<{ ok: true } | { ok: false; field: 'current'; message: string }> {
	const user = await users.read(userId);
	if (!user) return { ok: false, field: 'current', message: 'That account is gone.' };
	if (user.passwordHash && !(await checkPassword(user.passwordHash, current)))
		return { ok: false, field: 'current', message: 'That is not your current password.' };
	await inTransaction(async (t) => {
		await users.setPassword(userId, next, t);
		await endAllSessions(userId, t);
	});
	return { ok: true };
}
