import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';

// The security suite's own app: the production entry (scripts/production.js) on the test build,
// against the test stack's MariaDB, object store and mail server, on a port of its own. It runs
// as it would behind a proxy (ADDRESS_HEADER / XFF_DEPTH), so each test can be its own client
// address and the per-address limits of one test never reach another.

const root = path.resolve(import.meta.dirname, '../../..');

/** A complete production environment: only the operator's settings, no launcher variables. */
export function productionSettings(port: number): Record<string, string> {
	const e = process.env;
	return {
		PATH: e.PATH ?? '',
		HOME: e.HOME ?? '/root',
		AUTH_SECRET: e.AUTH_SECRET!,
		ORIGIN: `http://127.0.0.1:${port}`,
		PORT: String(port),
		HOST: '127.0.0.1',
		BUILD_DIR: e.BUILD_DIR!,
		DB_HOST: '127.0.0.1',
		DB_PORT: e.DB_PORT!,
		DB_NAME: e.DB_NAME!,
		DB_USER: e.DB_USER!,
		DB_PASSWORD: e.DB_PASSWORD!,
		S3_ENDPOINT: e.S3_ENDPOINT!,
		S3_BUCKET: e.S3_BUCKET!,
		S3_REGION: e.S3_REGION!,
		S3_ACCESS_KEY_ID: e.S3_ACCESS_KEY_ID!,
		S3_SECRET_ACCESS_KEY: e.S3_SECRET_ACCESS_KEY!,
		S3_FORCE_PATH_STYLE: 'true',
		SMTP_URL: e.SMTP_URL!,
		MAIL_FROM: 'Squishline <bench@squishline.test>'
	};
}

export type Entry = {
	child: ChildProcess;
	exited: Promise<number | null>;
	output: () => string;
};

export function runEntry(env: Record<string, string>, ms = 15_000): Entry {
	const child = spawn(process.execPath, ['scripts/production.js'], { cwd: root, env });
	let out = '';
	child.stdout!.on('data', (d) => (out += d));
	child.stderr!.on('data', (d) => (out += d));
	const exited = new Promise<number | null>((resolve) => {
		const timer = setTimeout(() => resolve(null), ms);
		child.once('exit', (code) => {
			clearTimeout(timer);
			resolve(code);
		});
	});
	return { child, exited, output: () => out };
}

export type App = {
	/** Where the app listens. */
	origin: string;
	entry: Entry;
	stop: () => Promise<void>;
};

/** Starts the production entry and waits until /api/health answers. */
export async function startApp(port: number, extra: Record<string, string> = {}): Promise<App> {
	const origin = `http://127.0.0.1:${port}`;
	const entry = runEntry(
		{
			...productionSettings(port),
			ADDRESS_HEADER: 'x-forwarded-for',
			XFF_DEPTH: '1',
			SHUTDOWN_TIMEOUT: '1',
			...extra
		},
		10 * 60_000
	);
	for (let i = 0; i < 300; i++) {
		const res = await fetch(`${origin}/api/health`, {
			headers: { 'x-forwarded-for': '198.51.100.1' }
		}).catch(() => null);
		if (res) break;
		await new Promise((r) => setTimeout(r, 100));
	}
	return {
		origin,
		entry,
		stop: async () => {
			entry.child.kill('SIGTERM');
			const timer = setTimeout(() => entry.child.kill('SIGKILL'), 8_000);
			await entry.exited;
			clearTimeout(timer);
		}
	};
}

let addressCounter = 0;
/** A client address no other test (or test file) uses. */
export function freshAddress(): string {
	addressCounter++;
	return `10.${process.pid % 250}.${Math.floor(addressCounter / 250)}.${addressCounter % 250}`;
}

/** A browser-like client: keeps cookies, sends this site's Origin on writes, never follows redirects. */
export class Client {
	readonly cookies = new Map<string, string>();
	constructor(
		readonly origin: string,
		readonly address = freshAddress(),
		/** Where to connect, when the site's ORIGIN (https behind a proxy) is not it. */
		readonly base = origin
	) {}

	async fetch(pathname: string, init: RequestInit = {}): Promise<Response> {
		const headers = new Headers(init.headers);
		headers.set('x-forwarded-for', this.address);
		if (!headers.has('origin') && init.method && init.method !== 'GET')
			headers.set('origin', this.origin);
		if (this.cookies.size)
			headers.set('cookie', [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; '));
		const res = await fetch(new URL(pathname, this.base), {
			...init,
			headers,
			redirect: 'manual'
		});
		for (const c of res.headers.getSetCookie()) {
			const [pair, ...attrs] = c.split(';');
			const i = pair.indexOf('=');
			const name = pair.slice(0, i).trim();
			const value = pair.slice(i + 1).trim();
			const expired = attrs.some((a) => /max-age=0|expires=thu, 01 jan 1970/i.test(a.trim()));
			if (expired || !value) this.cookies.delete(name);
			else this.cookies.set(name, value);
		}
		return res;
	}

	/** Posts a form action the way a browser without scripts would. */
	form(pathname: string, fields: Record<string, string>, headers: Record<string, string> = {}) {
		return this.fetch(pathname, {
			method: 'POST',
			headers: {
				'content-type': 'application/x-www-form-urlencoded',
				accept: 'text/html',
				...headers
			},
			body: new URLSearchParams(fields).toString()
		});
	}

	async signIn(email: string, password: string): Promise<Response> {
		return this.form('/signin?/password', { email, password, next: '/bench' });
	}

	/** The session cookie, to hand to another client as a thief would. */
	sessionCookies(): Map<string, string> {
		return new Map([...this.cookies].filter(([k]) => k.includes('session-token')));
	}
}
