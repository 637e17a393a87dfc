import type { TokenProblem } from '../../shops/problems';
import { readToken, signToken } from '../mail/signed-links';

export type { TokenProblem };

// Links mailed for shop steps (approve or decline a link, accept a build, join a shop's staff):
// signed so they cannot be made up, carrying their expiry so an old one is refused, and spent by
// the step itself (a decided request cannot be decided again), so each works once.

export const LINK_LIFETIME_MS = 24 * 3600 * 1000;

export type Purpose = 'shop-link' | 'build-transfer' | 'shop-staff';
export type Checked<T> = { ok: true; payload: T } | { ok: false; problem: TokenProblem };

export function makeToken(purpose: Purpose, payload: Record<string, unknown>, now: Date): string {
	return signToken(purpose, { ...payload, exp: now.getTime() + LINK_LIFETIME_MS });
}

export function checkToken<T extends Record<string, unknown>>(
	purpose: Purpose,
	token: string,
	now: Date
): Checked<T & { exp: number }> {
	const p = readToken<T & { exp: number }>(purpose, token);
	if (!p || typeof p.exp !== 'number') return { ok: false, problem: 'forged' };
	if (p.exp < now.getTime()) return { ok: false, problem: 'expired' };
	return { ok: true, payload: p };
}
