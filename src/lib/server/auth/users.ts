import type { Transaction } from 'sequelize';
import type { Role } from '../../roles';
import { hashPassword } from './password';
import { models, type User } from '../db/models';
import { scalar } from '../db/nested';

export type UserPatch = Partial<
	Pick<
		User,
		| 'name'
		| 'units'
		| 'theme'
		| 'mailComments'
		| 'mailShop'
		| 'role'
		| 'suspendedAt'
		| 'suspendedReason'
		| 'suspendedUntil'
	>
>;

export const normaliseEmail = (email: string) => email.trim().toLowerCase();

export async function read(id: string, opts: { fromPrimary?: boolean } = {}) {
	return models().User.findByPk(id, opts.fromPrimary ? { useMaster: true } : {});
}

/** A member's display name as a column of a page's one SELECT (db/nested.ts): nothing else. */
export const nameColumn = (idSql: string) =>
	scalar(`(SELECT name FROM users WHERE id = ${idSql})`, (v) => (v as string | null) ?? null);

export async function readByEmail(email: string) {
	return models().User.findOne({ where: { email: normaliseEmail(email) } });
}

export async function create(input: {
	email: string;
	name: string | null;
	password?: string;
	role?: Role;
	verified?: boolean;
	units?: 'metric' | 'imperial';
}) {
	return models().User.create({
		email: normaliseEmail(input.email),
		name: input.name,
		passwordHash: input.password ? await hashPassword(input.password) : null,
		role: input.role ?? 'member',
		units: input.units ?? 'metric',
		emailVerified: input.verified ? new Date() : null
	});
}

export async function update(id: string, patch: UserPatch) {
	await models().User.update(patch, { where: { id } });
}

export async function setPassword(id: string, password: string, transaction?: Transaction) {
	await models().User.update(
		{ passwordHash: await hashPassword(password) },
		{ where: { id }, transaction }
	);
}

export async function markVerified(id: string, transaction?: Transaction) {
	await models().User.update(
		{ emailVerified: new Date() },
		{ where: { id, emailVerified: null }, transaction }
	);
}

export async function count() {
	return models().User.count();
}
