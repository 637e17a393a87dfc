import { Failure } from '../../failure';
import { Op, type Order, type WhereOptions } from 'sequelize';
import { activeSuspension } from '../../review/suspension';
import { ROLES, type Role } from '../../roles';
import type { CurrentUser } from '../auth/current-user';
import { endAllSessions } from '../auth/sessions';
import { inTransaction } from '../db/transaction';
import { models, type User } from '../db/models';
import * as users from '../auth/users';
import * as log from '../review/log';

export const USER_SORTS = ['newest', 'oldest', 'name', 'email'] as const;
export type UserSort = (typeof USER_SORTS)[number];

export type UserFilter = {
	q?: string;
	role?: Role;
	suspended?: boolean;
	sort?: UserSort;
	page?: number;
};

export const USERS_PAGE = 50;

const ORDER: Record<UserSort, Order> = {
	newest: [['createdAt', 'DESC']],
	oldest: [['createdAt', 'ASC']],
	name: [
		['name', 'ASC'],
		['email', 'ASC']
	],
	email: [['email', 'ASC']]
};

/** The admin's table of accounts: search by name or address, filter by role or suspension. */
export async function listUsers(f: UserFilter, now: Date) {
	const where: WhereOptions<User>[] = [];
	if (f.q) {
		const like = `%${f.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
		where.push({ [Op.or]: [{ name: { [Op.like]: like } }, { email: { [Op.like]: like } }] });
	}
	if (f.role && ROLES.includes(f.role)) where.push({ role: f.role });
	if (f.suspended) {
		where.push({ suspendedAt: { [Op.ne]: null } });
		where.push({ [Op.or]: [{ suspendedUntil: null }, { suspendedUntil: { [Op.gt]: now } }] });
	}
	const page = Math.max(1, f.page ?? 1);
	const { rows, count } = await models().User.findAndCountAll({
		where: { [Op.and]: where },
		order: ORDER[f.sort ?? 'newest'],
		limit: USERS_PAGE,
		offset: (page - 1) * USERS_PAGE
	});
	return {
		total: count,
		page,
		pageSize: USERS_PAGE,
		rows: rows.map((u) => ({
			id: u.id,
			name: u.name,
			email: u.email,
			role: u.role,
			joined: u.createdAt.toISOString(),
			suspension: activeSuspension(u, now)
		}))
	};
}

/** Changes an account's role; an admin cannot demote themselves (someone must stay admin). */
export async function changeRole(me: CurrentUser, userId: string, role: Role, now: Date) {
	return inTransaction(async () => {
		const u = await users.read(userId);
		if (!u) throw new Failure(404, 'No such account.');
		if (u.id === me.id) throw new Failure(403, 'Ask another admin to change your own role.');
		if (u.role === role) return;
		await users.update(u.id, { role });
		await log.append({
			at: now,
			actorId: me.id,
			action: 'change-role',
			subjectId: u.id,
			detail: { from: u.role, to: role }
		});
	});
}

/** Signs an account out on every device (a stolen session, a shared computer); logged. */
export async function endSessionsOf(me: CurrentUser, userId: string, now: Date) {
	const u = await users.read(userId);
	if (!u) throw new Failure(404, 'No such account.');
	// Both or neither: an admin's step is never taken without its line in the log.
	await inTransaction(async (t) => {
		await endAllSessions(u.id, t);
		await log.append(
			{ at: now, actorId: me.id, action: 'end-sessions', subjectId: u.id, detail: {} },
			t
		);
	});
}
