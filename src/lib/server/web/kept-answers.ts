import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
import type { Handle, RequestEvent } from '@sveltejs/kit';
import { LRUCache } from 'lru-cache';
import Negotiator from 'negotiator';
import { QueryTypes } from 'sequelize';
import { db } from '../db/connection';
import { WRITTEN_COOKIE } from '../db/replica';
import { env } from '../env';

// Whole answers for readers who are not signed in, kept per process under `public_version`
// (db/public-writes.ts: it moves on after every committed change a page might show). While it
// has not moved, a build page, a list or public JSON costs one primary-key lookup and a write of
// bytes already compressed, instead of its queries, Svelte's render, an ETag and brotli. Exact:
// an answer is served only under the version it was made under, and kept only when the version
// was the same after it was made as before. Time still moves what a page says ("3 days ago",
// signed photo links), so an answer is also made afresh once it is a minute old.
//
// What an anonymous answer depends on besides the address: the Accept-Language header (the parts
// currency) and the Accept header (a route with both a page and JSON). Signed-in readers and
// members who have just saved (read-your-writes) are never served from here; no page reads any
// other cookie. Only answers the app marked public (web/public-cache.ts) are kept.

const MAX_AGE_MS = 60_000;
const MAX_BODY = 2 * 2 ** 20;
const COMPRESSIBLE = /^(text\/|application\/(json|xml|javascript)|image\/svg\+xml)/;
const SESSION_COOKIE = /(^|;\s*)(__Secure-)?authjs\.session-token(\.\d+)?=/;
const JUST_WROTE = new RegExp(`(^|;\\s*)${WRITTEN_COOKIE}=`);

type Kept = {
	v: number;
	made: number;
	status: number;
	headers: [string, string][];
	body: Buffer;
	encoded: Map<string, Buffer>;
};

let cache: LRUCache<string, Kept> | null = null;
let cacheBytes = -1;
const making = new Map<string, Promise<Kept | null>>();

function keep(): LRUCache<string, Kept> | null {
	const bytes = Math.floor(env().KEPT_ANSWERS_MB * 2 ** 20);
	if (bytes !== cacheBytes) {
		cacheBytes = bytes;
		cache = bytes > 0 ? new LRUCache({ maxSize: bytes, sizeCalculation: sizeOf }) : null;
	}
	return cache;
}

// The body and room for its compressed copies, made later as readers ask (text compresses to
// well under a quarter; both codings together stay under half the body).
const sizeOf = (k: Kept) => Math.ceil(k.body.length * 1.5) + 512;

/** The version answers are kept under; read where the page's own reads go. */
export async function publicVersion(): Promise<number> {
	const [row] = await db().query<{ v: number }>('SELECT v FROM public_version WHERE id = 1', {
		type: QueryTypes.SELECT
	});
	return Number(row?.v ?? 0);
}

function keyOf(event: RequestEvent): string | null {
	const h = event.request.headers;
	if (event.request.method !== 'GET') return null;
	const cookie = h.get('cookie') ?? '';
	if (SESSION_COOKIE.test(cookie) || JUST_WROTE.test(cookie)) return null;
	// A client that asks to bypass caches gets a fresh answer (and refreshes the kept one).
	if (/no-cache/.test(h.get('cache-control') ?? '') || /no-cache/.test(h.get('pragma') ?? ''))
		return null;
	const u = new URL(event.request.url);
	return `${u.pathname}${u.search}\n${h.get('accept') ?? ''}\n${h.get('accept-language') ?? ''}`;
}

export const keptAnswers: Handle = async ({ event, resolve }) => {
	const store = keep();
	const key = store && keyOf(event);
	if (!store || !key) return resolve(event);
	let v: number;
	try {
		v = await publicVersion();
	} catch {
		// No database: the page itself says so.
		return resolve(event);
	}
	const hit = store.get(key);
	if (hit && hit.v === v && Date.now() - hit.made < MAX_AGE_MS)
		return served(hit, event.request, 'HIT');
	// Readers asking for the same answer at the same moment wait for one making of it.
	const pending = making.get(key);
	if (pending) {
		const made = await pending;
		if (made && made.v === v) return served(made, event.request, 'HIT');
		return resolve(event);
	}
	let settle!: (k: Kept | null) => void;
	making.set(key, new Promise<Kept | null>((r) => (settle = r)));
	try {
		const response = await resolve(event);
		const made = await keepable(response, v);
		settle(made.kept);
		if (!made.kept) return made.response;
		store.set(key, made.kept);
		return served(made.kept, event.request, 'MISS');
	} catch (e) {
		settle(null);
		throw e;
	} finally {
		making.delete(key);
	}
};

/** The answer as bytes, if it may be kept: public, whole, and made under a version that held. */
async function keepable(
	response: Response,
	v: number
): Promise<{ kept: Kept | null; response: Response }> {
	if (
		response.status !== 200 ||
		!/\bpublic\b/.test(response.headers.get('cache-control') ?? '') ||
		response.headers.has('set-cookie') ||
		response.headers.has('content-encoding') ||
		Number(response.headers.get('content-length') ?? 0) > MAX_BODY
	)
		return { kept: null, response };
	const body = Buffer.from(await response.arrayBuffer());
	const headers = [...response.headers].filter(([k]) => k !== 'content-length' && k !== 'date');
	// Something changed while it was being made: it may hold a mix of before and after.
	if (body.length > MAX_BODY || (await publicVersion().catch(() => -1)) !== v)
		return { kept: null, response: new Response(sendable(body), { status: 200, headers }) };
	return {
		kept: { v, made: Date.now(), status: 200, headers, body, encoded: new Map() },
		response
	};
}

// Node's Buffers are Uint8Arrays over an ArrayBuffer; the DOM typings want to be told.
const sendable = (b: Buffer) => b as unknown as Uint8Array<ArrayBuffer>;

function served(k: Kept, request: Request, state: 'HIT' | 'MISS'): Response {
	const headers = new Headers(k.headers);
	headers.set('x-kept-answer', state);
	const type = headers.get('content-type') ?? '';
	if (k.body.length < 1024 || !COMPRESSIBLE.test(type))
		return new Response(sendable(k.body), { status: k.status, headers });
	headers.append('vary', 'Accept-Encoding');
	const coding = new Negotiator({
		headers: { 'accept-encoding': request.headers.get('accept-encoding') ?? '' }
	}).encoding(['br', 'gzip', 'identity']);
	if (coding !== 'br' && coding !== 'gzip')
		return new Response(sendable(k.body), { status: k.status, headers });
	let bytes = k.encoded.get(coding);
	if (!bytes) {
		// Once per answer, so a little more effort than per-request compression affords.
		bytes =
			coding === 'br'
				? brotliCompressSync(k.body, {
						params: {
							[constants.BROTLI_PARAM_QUALITY]: 6,
							[constants.BROTLI_PARAM_SIZE_HINT]: k.body.length
						}
					})
				: gzipSync(k.body, { level: 6 });
		k.encoded.set(coding, bytes);
	}
	headers.set('content-encoding', coding);
	return new Response(sendable(bytes), { status: k.status, headers });
}
