import * as users from './users';
import { forget, passwordAttemptsByAddress, passwordFailures, isBlocked, take } from './limits';
import { checkPassword, hashPassword } from './password';

export type PasswordSignInResult =
	| { ok: true; user: { id: string; email: string; name: string | null } }
	| { ok: false; code: 'credentials' | 'unverified' | 'rate-limited' | 'address-limited' };

// Checked against when the address has no account (or no password), so a wrong answer costs
// the same argon2 work either way and its timing does not tell whether the account exists.
let dummyHash: Promise<string> | null = null;
const dummy = () => (dummyHash ??= hashPassword('no account has this password'));

/**
 * The one gate for e-mail + password sign-in, used by Auth.js's authorize() — which every door
 * (the sign-in form and a direct POST to /auth/callback/password) goes through. Attempts count
 * per client address (30 in 15 minutes, right or wrong) and failures per account (5), so
 * spraying many accounts from one address and guessing one account from many both stop.
 */
export async function verifyPasswordSignIn(
	email: string,
	password: string,
	address: string
): Promise<PasswordSignInResult> {
	if (!(await take(passwordAttemptsByAddress, address))) {
		return { ok: false, code: 'address-limited' };
	}
	const key = users.normaliseEmail(email);
	if (await isBlocked(passwordFailures, key)) return { ok: false, code: 'rate-limited' };
	const user = await users.readByEmail(key);
	const matches = user?.passwordHash
		? await checkPassword(user.passwordHash, password)
		: (await checkPassword(await dummy(), password)) && false;
	if (!user || !matches) {
		await take(passwordFailures, key);
		return { ok: false, code: 'credentials' };
	}
	if (!user.emailVerified) return { ok: false, code: 'unverified' };
	await forget(passwordFailures, key);
	return { ok: true, user: { id: user.id, email: user.email, name: user.name } };
}

/** A completed reset proves the owner: their account's lock goes. */
export async function liftAccountLock(email: string): Promise<void> {
	await forget(passwordFailures, users.normaliseEmail(email));
}
