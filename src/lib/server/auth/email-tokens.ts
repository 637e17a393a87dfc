import { createHash, randomBytes } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { models } from '../db/models';
import type { EmailTokenPurpose } from '../db/models/email-token';

const LIFETIME_MS: Record<EmailTokenPurpose, number> = {
	verify: 48 * 3600_000,
	reset: 3600_000
};

const digest = (token: string) => createHash('sha256').update(token).digest('hex');

/** A fresh single-use token; only its hash is stored, so a database leak yields no working links. */
export async function issue(userId: string, purpose: EmailTokenPurpose): Promise<string> {
	const token = randomBytes(32).toString('base64url');
	await models().EmailToken.create({
		userId,
		purpose,
		tokenHash: digest(token),
		expiresAt: new Date(Date.now() + LIFETIME_MS[purpose])
	});
	return token;
}

export type TokenCheck =
	{ ok: true; userId: string } | { ok: false; reason: 'unknown' | 'used' | 'expired' };

/** Looks a token up without spending it (for showing the reset form). */
export async function inspect(token: string, purpose: EmailTokenPurpose): Promise<TokenCheck> {
	const row = await models().EmailToken.findOne({ where: { tokenHash: digest(token), purpose } });
	if (!row) return { ok: false, reason: 'unknown' };
	if (row.usedAt) return { ok: false, reason: 'used' };
	if (row.expiresAt.getTime() < Date.now()) return { ok: false, reason: 'expired' };
	return { ok: true, userId: row.userId };
}

/** Spends a token atomically: of two concurrent uses, only one succeeds. */
export async function consume(
	token: string,
	purpose: EmailTokenPurpose,
	transaction?: Transaction
): Promise<TokenCheck> {
	const check = await inspect(token, purpose);
	if (!check.ok) return check;
	const [n] = await models().EmailToken.update(
		{ usedAt: new Date() },
		{
			where: {
				tokenHash: digest(token),
				purpose,
				usedAt: null,
				expiresAt: { [Op.gt]: new Date() }
			},
			transaction
		}
	);
	return n === 1 ? check : { ok: false, reason: 'used' };
}
