import type { CurrentUser } from '../../src/lib/server/auth/current-user';

/** Just enough of a SvelteKit RequestEvent to call a load or an action directly. */
export function fakeEvent(opts: {
	user?: CurrentUser | null;
	params?: Record<string, string>;
	path?: string;
	/** The client address the rate limits see; tests that post a lot give each event its own. */
	address?: string;
	form?: Record<string, string>;
	request?: { method: string; body?: BodyInit; headers?: Record<string, string> };
}) {
	const url = new URL(`http://127.0.0.1${opts.path ?? '/'}`);
	let request = new Request(url);
	if (opts.form) {
		const fd = new FormData();
		for (const [k, v] of Object.entries(opts.form)) fd.set(k, v);
		request = new Request(url, { method: 'POST', body: fd });
	}
	if (opts.request) request = new Request(url, opts.request);
	return {
		url,
		request,
		params: opts.params ?? {},
		locals: { user: opts.user ?? null },
		route: { id: null },
		getClientAddress: () => opts.address ?? '127.0.0.1',
		cookies: { get: () => undefined, getAll: () => [], set() {}, delete() {}, serialize: () => '' },
		setHeaders() {},
		parent: async () => ({}),
		depends() {},
		untrack: <T>(fn: () => T) => fn()
	} as never;
}

export const asUser = (
	u: { id: string; email: string },
	role: CurrentUser['role'] = 'member'
): CurrentUser => ({
	id: u.id,
	email: u.email,
	name: 'Tester',
	role,
	units: 'metric',
	theme: 'device',
	suspension: null
});
