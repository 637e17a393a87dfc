import * as users from '../db/users';
import { passwordFailures, isBlocked, take } from './limits';
import { checkPassword } from './password';

export type PasswordSignInResult =
	| { ok: true; user: { id: string; email: string; name: string | null } }
	| { ok: false; code: 'credentials' | 'unverified' | 'rate-limited' };

/**
 * The one gate for e-mail + password sign-in, used by Auth.js's authorize(). Failures count per
 * account, so guessing one account's password from many addresses still stops after five tries.
 */
export async function verifyPasswordSignIn(
	email: string,
	password: string
): Promise<PasswordSignInResult> {
	const key = users.normaliseEmail(email);
	if (await isBlocked(passwordFailures, key)) return { ok: false, code: 'rate-limited' };
	const user = await users.readByEmail(key);
	if (!user || !(await checkPassword(user.passwordHash, password))) {
		await take(passwordFailures, key);
		return { ok: false, code: 'credentials' };
	}
	if (!user.emailVerified) return { ok: false, code: 'unverified' };
	await passwordFailures.delete(key);
	return { ok: true, user: { id: user.id, email: user.email, name: user.name } };
}
