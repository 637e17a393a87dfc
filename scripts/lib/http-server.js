// The adapter-node build served by our own HTTP server (adapter-node's documented custom-server
// pattern): its `handler.js` behind the `compression` middleware, so every text answer over 1 kB
// goes out as brotli or gzip, whichever the client asks for (brotli first; quality 4 keeps it
// cheap per request). Compression lives here rather than in an edge server so that one process
// alone, as `npm start` and `npm run serve` run it, already sends small pages; an edge server in
// front may take it over later. Shutdown follows the adapter's own server: stop taking
// connections, let open requests finish (SHUTDOWN_TIMEOUT seconds at most), then tell the app
// (`sveltekit:shutdown`) so it stops its timers and closes the database pool.
import http from 'node:http';
import path from 'node:path';
import compression from 'compression';

export async function serveBuild(buildDir) {
	const { handler } = await import(path.join(path.resolve(buildDir), 'handler.js'));
	const compress = compression({ threshold: 1024 });
	const server = http.createServer((req, res) =>
		compress(req, res, (err) => {
			if (err) {
				res.statusCode = 500;
				res.end();
				return;
			}
			handler(req, res);
		})
	);
	const seconds = (name) => {
		const v = Number(process.env[name]);
		return Number.isFinite(v) && v > 0 ? v : undefined;
	};
	if (seconds('KEEP_ALIVE_TIMEOUT')) server.keepAliveTimeout = seconds('KEEP_ALIVE_TIMEOUT') * 1000;
	if (seconds('HEADERS_TIMEOUT')) server.headersTimeout = seconds('HEADERS_TIMEOUT') * 1000;

	const host = process.env.HOST ?? '0.0.0.0';
	const port = Number(process.env.PORT ?? 3000);
	await new Promise((resolve) => server.listen({ host, port }, resolve));
	console.log(`Listening on http://${host}:${port}`);

	let stopping = null;
	const stop = (reason) => {
		if (stopping) return;
		server.closeIdleConnections();
		server.close(() => {
			clearTimeout(stopping);
			process.emit('sveltekit:shutdown', reason);
		});
		stopping = setTimeout(
			() => server.closeAllConnections(),
			(seconds('SHUTDOWN_TIMEOUT') ?? 30) * 1000
		);
		stopping.unref();
	};
	for (const signal of ['SIGTERM', 'SIGINT']) process.on(signal, () => stop(signal));
	return server;
}
