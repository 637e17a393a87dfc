// The edge stage of `npm run perf`: the same production build behind nginx (scripts/lib/nginx.js,
// as `npm run serve:cluster` runs it). It measures the build page through nginx with one app
// process and with two (the edge cache off: each request reaches an app), then with the edge cache
// on (anonymous answers kept ten seconds) beside a static asset nginx serves from disk.
import fs from 'node:fs';
import path from 'node:path';
import autocannon, { type Result } from 'autocannon';
import { startNginx } from '../../scripts/lib/nginx.js';
import { startApp, type App } from '../security/support/app';

export type EdgeFigure = {
	reqPerS: number;
	p50Ms: number;
	p99Ms: number;
	errors: number;
	non2xx: number;
};

const figure = (r: Result): EdgeFigure => ({
	reqPerS: Number(r.requests.average.toFixed(1)),
	p50Ms: r.latency.p50,
	p99Ms: r.latency.p99,
	errors: r.errors + r.timeouts,
	non2xx: r.non2xx
});

const median = (xs: number[]) => {
	const s = [...xs].sort((a, b) => a - b);
	return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

type Opts = { rounds: number; seconds: number; warmupSeconds: number; connections: number };

async function measure(origin: string, pathname: string, o: Opts): Promise<EdgeFigure> {
	const run = (duration: number) =>
		autocannon({
			url: origin,
			connections: o.connections,
			duration,
			headers: { 'accept-encoding': 'br, gzip' },
			requests: [{ method: 'GET', path: pathname }]
		});
	const rounds: Result[] = [];
	for (let i = 0; i < o.rounds; i++) {
		if (o.warmupSeconds > 0) await run(o.warmupSeconds);
		rounds.push(await run(o.seconds));
	}
	const figs = rounds.map(figure);
	return {
		reqPerS: Number(median(figs.map((f) => f.reqPerS)).toFixed(1)),
		p50Ms: median(figs.map((f) => f.p50Ms)),
		p99Ms: median(figs.map((f) => f.p99Ms)),
		errors: figs.reduce((a, f) => a + f.errors, 0),
		non2xx: figs.reduce((a, f) => a + f.non2xx, 0)
	};
}

/** n app processes (the production entry) behind a fresh nginx; stops them all afterwards. */
async function withEdge<T>(
	n: number,
	edgeSeconds: number,
	fn: (origin: string) => Promise<T>
): Promise<T> {
	const base = Number(process.env.PERF_EDGE_PORT ?? 3210);
	const apps: App[] = [];
	let nginx: Awaited<ReturnType<typeof startNginx>> | null = null;
	try {
		for (let i = 0; i < n; i++)
			apps.push(
				await startApp(base + 1 + i, {
					ORIGIN: `http://127.0.0.1:${base}`,
					EDGE_CACHE_SECONDS: String(edgeSeconds)
				})
			);
		const runDir = path.join(process.env.RUN_DIR!, 'edge');
		// Each configuration starts with an empty edge cache.
		fs.rmSync(path.join(runDir, 'nginx', 'cache'), { recursive: true, force: true });
		nginx = await startNginx(
			{
				PORT: String(base),
				RUN_DIR: runDir,
				BUILD_DIR: process.env.BUILD_DIR!
			},
			apps.map((_, i) => base + 1 + i)
		);
		return await fn(`http://127.0.0.1:${base}`);
	} finally {
		await nginx?.stop();
		for (const a of apps) await a.stop();
	}
}

export async function benchEdge(buildPage: string, asset: string, o: Opts) {
	const one = await withEdge(1, 0, (origin) => measure(origin, buildPage, o));
	const two = await withEdge(2, 0, (origin) => measure(origin, buildPage, o));
	const cached = await withEdge(2, 10, async (origin) => ({
		page: await measure(origin, buildPage, o),
		asset: await measure(origin, asset, o)
	}));
	return {
		connections: o.connections,
		seconds: o.seconds,
		rounds: o.rounds,
		buildPage,
		oneProcess: one,
		twoProcesses: two,
		twoOverOne: Number((two.reqPerS / one.reqPerS).toFixed(2)),
		cachedPage: cached.page,
		staticViaNginx: cached.asset,
		cachedOfStatic: Number((cached.page.reqPerS / cached.asset.reqPerS).toFixed(3))
	};
}
