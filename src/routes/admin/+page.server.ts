import { fail } from '@sveltejs/kit';
import { ROLES, type Role } from '$lib/roles';
import { adminSuspendSchema, roleChangeSchema, userRefSchema } from '$lib/schemas/shops';
import {
	changeRole,
	endSessionsOf,
	listUsers,
	USER_SORTS,
	type UserSort
} from '$lib/server/admin/users';
import { clock } from '$lib/clock';
import { requireRole } from '$lib/server/guard';
import { liftSuspension, suspendUser } from '$lib/server/review/desk';
import { parseForm } from '$lib/server/web/plain-form';
import { forPages } from '$lib/server/web/page-failure';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'admin');
	const q = event.url.searchParams;
	const filter = {
		q: (q.get('q') ?? '').trim().slice(0, 100),
		role: ROLES.find((r) => r === q.get('role')) as Role | undefined,
		suspended: q.get('suspended') === '1',
		sort: (USER_SORTS.find((s) => s === q.get('sort')) ?? 'newest') as UserSort,
		page: Math.max(1, Number(q.get('page')) || 1)
	};
	const result = await listUsers(filter, clock());
	return { ...result, filter: { ...filter, role: filter.role ?? '' } };
};

const failed = (message: string, userId = '') => fail(400, { admin: { userId, message } });

export const actions: Actions = forPages({
	role: async (event) => {
		const me = requireRole(event, 'admin');
		const form = await parseForm(event.request, roleChangeSchema);
		if (!form.ok) return failed(form.message, form.values.userId);
		await changeRole(me, form.data.userId, form.data.role, clock());
		return { admin: { userId: form.data.userId, message: 'Role changed and logged.' } };
	},
	suspend: async (event) => {
		const me = requireRole(event, 'admin');
		const form = await parseForm(event.request, adminSuspendSchema);
		if (!form.ok) return failed(form.message, form.values.userId);
		await suspendUser(me, form.data.userId, form.data.reason, form.data.days, clock());
		return { admin: { userId: form.data.userId, message: 'Suspended, logged and mailed.' } };
	},
	endSessions: async (event) => {
		const me = requireRole(event, 'admin');
		const form = await parseForm(event.request, userRefSchema);
		if (!form.ok) return failed(form.message, form.values.userId);
		await endSessionsOf(me, form.data.userId, clock());
		return { admin: { userId: form.data.userId, message: 'Signed out everywhere; logged.' } };
	},
	lift: async (event) => {
		const me = requireRole(event, 'admin');
		const form = await parseForm(event.request, userRefSchema);
		if (!form.ok) return failed(form.message, form.values.userId);
		await liftSuspension(me, form.data.userId, 'lifted from the admin table', clock());
		return { admin: { userId: form.data.userId, message: 'Suspension lifted and logged.' } };
	}
});
