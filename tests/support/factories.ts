import { randomUUID } from 'node:crypto';
import type { Role } from '../../src/lib/roles';
import * as users from '../../src/lib/server/auth/users';

/** A fresh account with a unique address, so tests never step on the demo data or each other. */
export async function makeUser(
	opts: { role?: Role; verified?: boolean; password?: string; suspended?: boolean } = {}
) {
	const email = `t-${randomUUID().slice(0, 12)}@tests.squishline.test`;
	const password = opts.password ?? 'correct horse battery';
	const user = await users.create({
		email,
		name: `Tester ${email.slice(2, 8)}`,
		password,
		role: opts.role ?? 'member',
		verified: opts.verified ?? true
	});
	if (opts.suspended)
		await users.update(user.id, { suspendedAt: new Date(), suspendedReason: 'test' });
	return { id: user.id, email, password };
}

let addresses = 0;
/**
 * A client address no other call uses: per-address limits are counted in the database for the
 * whole test run, so tests that are not about those limits never share an address.
 */
export function anyAddress(): string {
	addresses++;
	return `10.${200 + (process.pid % 50)}.${Math.floor(addresses / 250) % 250}.${addresses % 250}`;
}
