/// <reference no-default-lib="true"/>
/// <reference lib="esnext" />
/// <reference lib="webworker" />
/// <reference types="@sveltejs/kit" />
// The app at the track: the scripts, styles, fonts and icons the member's pages use are kept as
// they are first fetched (never all at install: downloading the whole app beside the first page
// slowed a phone's first page by 100–200 ms of blocked main thread, and costs data at the track);
// pages a member opens are fetched from the network first and a copy kept, so the bench and the
// last viewed build pages and forms open without a signal. Nothing that changes anything is kept or
// answered from here: every POST goes to the server (the page queues it when there is no signal).
import { build, files, version } from '$service-worker';
import { KEPT_PAGES_CACHE, KEPT_PAGE_LIMIT, keepsPage } from './lib/offline/kept-pages';

const sw = self as unknown as ServiceWorkerGlobalScope;
const SHELL = `shell-${version}`;
const shellFiles = new Set([...build, ...files]);

sw.addEventListener('install', (event) => {
	event.waitUntil(sw.skipWaiting());
});

// A new version of the app: the old one's files go, and so do the pages kept with it (they name
// the old files, which the server no longer has either).
sw.addEventListener('activate', (event) => {
	event.waitUntil(
		caches
			.keys()
			.then(async (keys) => {
				const old = keys.filter((k) => k.startsWith('shell-') && k !== SHELL);
				if (old.length) await caches.delete(KEPT_PAGES_CACHE);
				await Promise.all(old.map((k) => caches.delete(k)));
			})
			.then(() => sw.clients.claim())
	);
});

/** The app's own files: from the copy once kept (their names change with each version of the
 * app, and the copies go with it), else fetched and kept. */
async function fromShell(request: Request): Promise<Response> {
	const kept = await caches.match(request, { cacheName: SHELL });
	if (kept) return kept;
	const answer = await fetch(request);
	if (answer.ok && answer.type === 'basic') {
		const copy = answer.clone();
		void caches.open(SHELL).then((c) => c.put(request, copy));
	}
	return answer;
}

/** Network first; a good answer is kept (the newest few dozen pages), a lost signal gets the kept
 * copy, or the words for a page that was never opened here. */
async function networkFirst(request: Request, keep: boolean): Promise<Response> {
	const url = new URL(request.url);
	const key = url.pathname + (url.pathname.endsWith('__data.json') ? '' : url.search);
	try {
		const answer = await fetch(request);
		if (keep && answer.ok && !answer.redirected && answer.type === 'basic') {
			const copy = answer.clone();
			void caches.open(KEPT_PAGES_CACHE).then(async (c) => {
				await c.put(key, copy);
				const keys = await c.keys();
				for (const old of keys.slice(0, Math.max(0, keys.length - KEPT_PAGE_LIMIT)))
					await c.delete(old);
			});
		}
		return answer;
	} catch (e) {
		const kept = await caches.match(key, { cacheName: KEPT_PAGES_CACHE });
		if (kept) return kept;
		if (request.mode !== 'navigate') throw e;
		return new Response(OFFLINE_PAGE, {
			status: 503,
			headers: { 'content-type': 'text/html; charset=utf-8' }
		});
	}
}

sw.addEventListener('fetch', (event) => {
	const request = event.request;
	if (request.method !== 'GET') return;
	const url = new URL(request.url);
	if (url.origin !== sw.location.origin) return;
	if (shellFiles.has(url.pathname)) return event.respondWith(fromShell(request));
	// Pages worth reading offline are kept; any other page opened without a signal gets the words.
	const keep = keepsPage(url.pathname);
	if (keep || request.mode === 'navigate') event.respondWith(networkFirst(request, keep));
});

const OFFLINE_PAGE = `<!doctype html><html lang="en"><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1"><title>No signal · Squishline</title>
<style>body{font:16px/1.5 system-ui,sans-serif;margin:2rem;max-width:36rem;background:#f6f1e7;color:#2b2b2b}</style>
</head><body><h1>No signal</h1><p>This page was not opened on this device before, so there is no copy of it here.
Your bench and the build pages you opened lately are kept: <a href="/bench">open the bench</a>.
Anything you save while offline waits on this device and is sent when the signal is back.</p></body></html>`;
