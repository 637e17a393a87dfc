import { json } from '@sveltejs/kit';
import { checkHealth } from '$lib/server/health';
import type { RequestHandler } from './$types';

// Public on purpose: load balancers and the start script poll it. It names services, not secrets.
export const GET: RequestHandler = async () => {
	const health = await checkHealth();
	const body = health.down.length
		? { ...health, error: `down: ${health.down.join(', ')}` }
		: health;
	return json(body, {
		status: health.down.length ? 503 : 200,
		headers: { 'cache-control': 'no-store' }
	});
};
