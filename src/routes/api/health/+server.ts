import { json } from '@sveltejs/kit';
import { roleAllows } from '$lib/roles';
import { checkHealth } from '$lib/server/web/health';
import { pendingCount } from '$lib/server/mail/queue';
import type { RequestHandler } from './$types';

// Public on purpose: load balancers and the start script poll it. The public answer is a bare
// status; which service is down, and why, is for admins only.
export const GET: RequestHandler = async ({ locals }) => {
	const health = await checkHealth();
	const status = health.down.length ? 503 : 200;
	const headers = { 'cache-control': 'no-store' };
	if (!locals.user || !roleAllows(locals.user.role, 'admin'))
		return json({ status: health.status }, { status, headers });
	// Letters waiting for the relay: a growing number means mail is not going out.
	const mailWaiting = health.services.database.up ? await pendingCount() : null;
	const body = {
		...health,
		mailWaiting,
		...(health.down.length ? { error: `down: ${health.down.join(', ')}` } : {})
	};
	return json(body, { status, headers });
};
