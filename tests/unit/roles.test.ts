import { describe, expect, it } from 'vitest';
import { roleAllows } from '../../src/lib/roles';
import { safeNext, signUpSchema } from '../../src/lib/schemas/account';

describe('roles', () => {
	it('an admin may do what a moderator may; a shop or member may not', () => {
		expect(roleAllows('admin', 'moderator')).toBe(true);
		expect(roleAllows('moderator', 'moderator')).toBe(true);
		expect(roleAllows('shop', 'moderator')).toBe(false);
		expect(roleAllows('member', 'moderator')).toBe(false);
		expect(roleAllows('member', 'member')).toBe(true);
		expect(roleAllows('moderator', 'admin')).toBe(false);
		expect(roleAllows('shop', 'shop')).toBe(true);
	});
});

describe('account schemas', () => {
	const base = {
		name: 'Ada',
		email: 'ada@example.org',
		password: 'ten chars!',
		confirm: 'ten chars!',
		terms: true
	};
	it('needs a password of at least 10 characters, typed twice alike', () => {
		expect(signUpSchema.safeParse(base).success).toBe(true);
		expect(
			signUpSchema.safeParse({ ...base, password: 'nine char', confirm: 'nine char' }).success
		).toBe(false);
		const r = signUpSchema.safeParse({ ...base, confirm: 'ten chars?' });
		expect(r.success).toBe(false);
		expect(r.error?.issues[0].path).toEqual(['confirm']);
	});
	it('only follows same-site paths after sign-in', () => {
		expect(safeNext('/review')).toBe('/review');
		expect(safeNext('//evil.example')).toBe('/');
		expect(safeNext('https://evil.example')).toBe('/');
		expect(safeNext(null)).toBe('/');
	});
});
