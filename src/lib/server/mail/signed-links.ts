import { createHmac, timingSafeEqual } from 'node:crypto';
import { env } from '../env';

// Signed, self-contained link tokens: base64url(JSON payload) + "." + HMAC-SHA256 over it, keyed
// by AUTH_SECRET plus a purpose, so a token made for one purpose never passes as another.

const key = (purpose: string) => {
	const secret = env().AUTH_SECRET;
	if (!secret) throw new Error('AUTH_SECRET is not set: signed links cannot be made or checked.');
	return `${purpose}:${secret}`;
};

const mac = (purpose: string, body: string) =>
	createHmac('sha256', key(purpose)).update(body).digest('base64url');

export function signToken(purpose: string, payload: Record<string, unknown>): string {
	const body = Buffer.from(JSON.stringify(payload)).toString('base64url');
	return `${body}.${mac(purpose, body)}`;
}

/** The payload when the signature is right; null for anything forged, cut or malformed. */
export function readToken<T extends Record<string, unknown>>(
	purpose: string,
	token: string
): T | null {
	const [body, sig, extra] = token.split('.');
	if (!body || !sig || extra !== undefined) return null;
	const want = Buffer.from(mac(purpose, body));
	const got = Buffer.from(sig);
	if (want.length !== got.length || !timingSafeEqual(want, got)) return null;
	try {
		const v = JSON.parse(Buffer.from(body, 'base64url').toString('utf8'));
		return v && typeof v === 'object' ? (v as T) : null;
	} catch {
		return null;
	}
}
