// The HTTP stage of `npm run perf`: the production build, served by the production entry
// (scripts/production.js: compression, no fakes), loaded with autocannon. Each round measures a
// static asset from the same process first, then every route, each after a warm-up; a route's rate
// is read against the static rate of its own round. Medians of the rounds are reported.
import autocannon, { type Result } from 'autocannon';
import { QueryTypes } from 'sequelize';
import { db } from '../../src/lib/server/db/connection';
import * as users from '../../src/lib/server/auth/users';
import * as builds from '../../src/lib/server/sheet/builds';
import { saveRun, saveSetup } from '../../src/lib/server/sheet/service';
import { setPublication } from '../../src/lib/server/sheet/build-service';
import { Client, type App } from '../security/support/app';
import { FIXTURE_SETUP, fixtureRun } from '../support/sheet-fixtures';

export type HttpFigure = {
	route: string;
	reqPerS: number;
	ofStatic: number;
	p50Ms: number;
	p99Ms: number;
	maxMs: number;
	errors: number;
	non2xx: number;
};

/** The first answer of each refused status a write got, so a failing write stage says why. */
export const refusals = new Map<number, string>();

type Route = { name: string; path: string; headers?: Record<string, string>; write?: boolean };

const median = (xs: number[]) => {
	const s = [...xs].sort((a, b) => a - b);
	return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

/** What the routes need: a build with five setups, a member who owns builds to save, a session. */
async function prepare(app: App, connections: number) {
	const password = 'bench password, long enough';
	const email = `bench-writer-${Date.now()}@perf.squishline.test`;
	const member = await users.create({ email, name: 'Bench writer', password, verified: true });
	const five = await builds.create(member.id, {
		title: 'Bench build with five setups',
		story: 'Five setups, each with two runs.'
	});
	for (let k = 0; k < 5; k++) {
		const s = (await saveSetup(five.id, {
			...FIXTURE_SETUP,
			mainJet: 90 + 2 * k,
			changeNote: `Main jet ${90 + 2 * k}`
		})) as { id: number };
		await saveRun(five.id, s.id, fixtureRun(70 + k));
		await saveRun(five.id, s.id, fixtureRun(69 + k));
	}
	await setPublication((await builds.read(five.id))!, 'published');
	// Builds and setups to save over and over, each lent to one request at a time (see load), twice
	// as many as connections so a lost answer leaves spares: drafts of the member's own, made
	// through the same service the sheet uses.
	const own: { id: number; build_id: number }[] = [];
	for (let k = 0; k < 2 * connections; k++) {
		const b = await builds.create(member.id, { title: `Bench writer's sheet ${k + 1}` });
		const s = (await saveSetup(b.id, { ...FIXTURE_SETUP, changeNote: 'Baseline' })) as {
			id: number;
		};
		own.push({ id: s.id, build_id: b.id });
	}
	const c = new Client(app.origin);
	const signedIn = await c.signIn(email, password);
	if (!c.sessionCookies().size)
		throw new Error(
			`bench sign-in made no session (${signedIn.status} ${signedIn.headers.get('location')})`
		);
	const cookie = [...c.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
	const home = await (await fetch(app.origin)).text();
	const asset = home.match(/\/_app\/immutable\/[^"']+\.css/)?.[0];
	if (!asset) throw new Error('no static asset found on the home page');
	const three = await db().query<{ id: number }>(
		"SELECT id FROM builds WHERE publication = 'published' ORDER BY id DESC LIMIT 3",
		{ type: QueryTypes.SELECT }
	);
	return { five: five.id, own, cookie, asset, three: three.map((r) => r.id) };
}

function routes(p: Awaited<ReturnType<typeof prepare>>): Route[] {
	return [
		{ name: 'home', path: '/' },
		{ name: 'builds, filtered', path: '/builds?exhaust=expansion-chamber&ccMin=65&ccMax=75' },
		{ name: 'build page, 5 setups', path: `/builds/${p.five}` },
		{ name: 'close builds page', path: '/close?cc=68&exhaust=expansion-chamber&carb=17' },
		{ name: 'speed map', path: '/speed-map?x=displacement' },
		{ name: 'side by side, 3', path: `/side-by-side?builds=${p.three.join(',')}` },
		{ name: 'search', path: '/builds?q=chamber' },
		{ name: 'GET /api/builds', path: '/api/builds?exhaust=sport' },
		{ name: 'GET /api/builds/close', path: '/api/builds/close?cc=50&carb=12' },
		{ name: 'GET /api/stats/speed-map', path: '/api/stats/speed-map?x=final-drive' },
		{ name: 'GET /api/stats/change-effects', path: '/api/stats/change-effects' },
		{ name: 'save a setup (signed in)', path: '/api/builds/:id/setups/:setup', write: true }
	];
}

async function load(
	app: App,
	r: Route,
	p: Awaited<ReturnType<typeof prepare>>,
	connections: number,
	seconds: number,
	versions = new Map<number, number>()
): Promise<Result> {
	const common = {
		url: app.origin,
		connections,
		duration: seconds,
		headers: { 'accept-encoding': 'br, gzip' }
	};
	if (!r.write)
		return autocannon({
			...common,
			headers: { ...common.headers, ...r.headers },
			requests: [{ method: 'GET', path: r.path }]
		});
	// Setups not in flight, each with the version its last answer gave. autocannon asks for a
	// connection's next request only after the answer to the last (no pipelining), but clears the
	// request's context each time round a one-request list: so the state lives here, and a setup is
	// lent to one request at a time, then handed back with the version the answer carried.
	const free = p.own.map((o) => ({ ...o, version: versions.get(o.id) ?? 0, jet: 80 }));
	type Lent = (typeof free)[number];
	return autocannon({
		...common,
		requests: [
			{
				method: 'PATCH',
				setupRequest: (req, ctx) => {
					const mine = free.shift();
					if (!mine) throw new Error('more connections than setups to save');
					mine.jet = 80 + ((mine.jet + 1) % 40);
					ctx.lent = mine;
					return {
						...req,
						path: `/api/builds/${mine.build_id}/setups/${mine.id}`,
						headers: {
							...req.headers,
							// Plain answers, so a refusal's words can be shown.
							'accept-encoding': 'identity',
							cookie: p.cookie,
							origin: app.origin,
							'content-type': 'application/json'
						},
						body: JSON.stringify({ version: mine.version, mainJet: mine.jet })
					};
				},
				onResponse: (status, body, ctx) => {
					const mine = ctx.lent as Lent;
					if (status === 200) {
						mine.version = (JSON.parse(body) as { version: number }).version;
						free.push(mine);
						return;
					}
					if (!refusals.has(status)) refusals.set(status, body.slice(0, 300));
					// A save still in flight when the last stage stopped may have moved the version
					// after it was read: lend the setup again once its version is read afresh.
					void syncVersions({ own: [mine] }).then((v) => {
						mine.version = v.get(mine.id) ?? mine.version;
						free.push(mine);
					});
				}
			}
		]
	});
}

/** Versions as they stand, so a round starts from what the last one left. */
async function syncVersions(p: { own: { id: number }[] }) {
	const rows = await db().query<{ id: number; version: number }>(
		'SELECT id, version FROM setups WHERE id IN (:ids)',
		{ replacements: { ids: p.own.map((o) => o.id) }, type: QueryTypes.SELECT }
	);
	return new Map(rows.map((r) => [r.id, r.version]));
}

const NO_CACHE = { 'cache-control': 'no-cache' };

/** The HTML pages the HTTP stage loads, for the page-weight stage run on its own. */
export async function pagesToWeigh(app: App) {
	const p = await prepare(app, 1);
	return routes(p).filter((r) => !r.write && !r.path.startsWith('/api/'));
}

export async function benchHttp(
	app: App,
	opts: { rounds: number; seconds: number; warmupSeconds: number; connections: number }
) {
	{
		const p = await prepare(app, opts.connections);
		const list = routes(p);
		const runs = new Map<string, { rate: number; ratio: number; r: Result }[]>();
		const afresh = new Map<string, { rate: number; ratio: number; r: Result }[]>();
		const statics: number[] = [];
		for (let round = 0; round < opts.rounds; round++) {
			const asset: Route = { name: 'static asset', path: p.asset };
			if (opts.warmupSeconds > 0) await load(app, asset, p, opts.connections, opts.warmupSeconds);
			const st = await load(app, asset, p, opts.connections, opts.seconds);
			statics.push(st.requests.average);
			for (const r of list) {
				const versions = r.write ? await syncVersions(p) : undefined;
				if (opts.warmupSeconds > 0)
					await load(app, r, p, opts.connections, opts.warmupSeconds, versions);
				// Saves the warm-up left in flight land before the versions are read again.
				if (r.write) await new Promise((done) => setTimeout(done, 1000));
				const got = await load(
					app,
					r,
					p,
					opts.connections,
					opts.seconds,
					r.write ? await syncVersions(p) : undefined
				);
				const entry = {
					rate: got.requests.average,
					ratio: got.requests.average / st.requests.average,
					r: got
				};
				runs.set(r.name, [...(runs.get(r.name) ?? []), entry]);
				if (r.write) continue;
				// The same route made afresh on every request (a client asking no-cache is never
				// served a kept answer): what a page costs when what it shows keeps changing.
				const fresh = await load(
					app,
					{ ...r, headers: NO_CACHE },
					p,
					opts.connections,
					opts.seconds
				);
				const freshEntry = {
					rate: fresh.requests.average,
					ratio: fresh.requests.average / st.requests.average,
					r: fresh
				};
				afresh.set(r.name, [...(afresh.get(r.name) ?? []), freshEntry]);
			}
		}
		const figure = (r: Route, xs: { rate: number; ratio: number; r: Result }[]): HttpFigure => {
			return {
				route: r.name,
				reqPerS: Number(median(xs.map((x) => x.rate)).toFixed(1)),
				ofStatic: Number(median(xs.map((x) => x.ratio)).toFixed(4)),
				p50Ms: median(xs.map((x) => x.r.latency.p50)),
				p99Ms: median(xs.map((x) => x.r.latency.p99)),
				maxMs: Math.max(...xs.map((x) => x.r.latency.max)),
				errors: xs.reduce((a, x) => a + x.r.errors + x.r.timeouts, 0),
				non2xx: xs.reduce((a, x) => a + x.r.non2xx, 0)
			};
		};
		const figures = list.map((r) => figure(r, runs.get(r.name)!));
		const madeAfresh = list.filter((r) => !r.write).map((r) => figure(r, afresh.get(r.name)!));
		return {
			connections: opts.connections,
			seconds: opts.seconds,
			rounds: opts.rounds,
			staticAsset: p.asset,
			staticReqPerS: Number(median(statics).toFixed(1)),
			routes: figures,
			/** The read routes again, each request asking for a fresh answer (no kept answers). */
			madeAfresh,
			/** The HTML pages among the routes, for the page-weight stage. */
			pages: list.filter((r) => !r.write && !r.path.startsWith('/api/'))
		};
	}
}
