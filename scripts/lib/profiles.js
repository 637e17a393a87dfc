// Ports, folders and names for the two stacks. `npm test` uses its own set so it can run
// while `npm start` is serving. Every value can be overridden from the environment.
import path from 'node:path';

const ROOT = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..', '..');

const DEFAULTS = {
	app: {
		PORT: '3000',
		DB_PORT: '3307',
		S3_PORT: '4569',
		SMTP_PORT: '2525',
		DB_NAME: 'squishline',
		DB_DATA_DIR: '.data/mariadb',
		S3_DATA_DIR: 'fake-storage/data',
		FAKE_MAIL_DIR: '.data/outbox',
		BUILD_DIR: 'build',
		RUN_DIR: '.data/run'
	},
	// `npm run perf`: its own MariaDB and a benchmark database, nothing else.
	perf: {
		PORT: '3200',
		DB_PORT: '3337',
		S3_PORT: '4599',
		SMTP_PORT: '2555',
		DB_NAME: 'squishline_perf',
		DB_DATA_DIR: '.data/perf-mariadb',
		S3_DATA_DIR: '.data/perf-s3',
		FAKE_MAIL_DIR: '.data/perf-outbox',
		BUILD_DIR: '.data/perf-build',
		RUN_DIR: '.data/perf-run'
	},
	// `npm run serve:cluster`: nginx on PORT in front of APP_PROCESSES app processes (APP_PORT,
	// APP_PORT + 1, …), a primary MariaDB and a replica, and the fakes.
	cluster: {
		PORT: '3500',
		APP_PORT: '3501',
		DB_PORT: '3347',
		DB_REPLICA_PORT: '3348',
		S3_PORT: '4609',
		SMTP_PORT: '2565',
		DB_NAME: 'squishline',
		DB_DATA_DIR: '.data/cluster-mariadb',
		DB_REPLICA_DATA_DIR: '.data/cluster-replica',
		S3_DATA_DIR: '.data/cluster-s3',
		FAKE_MAIL_DIR: '.data/cluster-outbox',
		BUILD_DIR: 'build',
		RUN_DIR: '.data/cluster-run'
	},
	// The same topology for the fault tests (tests/cluster), from empty data folders each run.
	'cluster-test': {
		PORT: '3600',
		APP_PORT: '3601',
		DB_PORT: '3357',
		DB_REPLICA_PORT: '3358',
		S3_PORT: '4619',
		SMTP_PORT: '2575',
		DB_NAME: 'squishline_cluster',
		DB_DATA_DIR: '.data/ctest-mariadb',
		DB_REPLICA_DATA_DIR: '.data/ctest-replica',
		S3_DATA_DIR: '.data/ctest-s3',
		FAKE_MAIL_DIR: '.data/ctest-outbox',
		BUILD_DIR: '.data/test-build',
		RUN_DIR: '.data/ctest-run'
	},
	test: {
		PORT: '3100',
		DB_PORT: '3317',
		S3_PORT: '4579',
		SMTP_PORT: '2535',
		DB_NAME: 'squishline_test',
		DB_DATA_DIR: '.data/test-mariadb',
		S3_DATA_DIR: 'fake-storage/test-data',
		FAKE_MAIL_DIR: '.data/test-outbox',
		BUILD_DIR: '.data/test-build',
		RUN_DIR: '.data/test-run'
	}
};

/** The full environment for one stack: defaults, then the caller's environment on top. */
export function stackEnv(name, outer = process.env) {
	const base = DEFAULTS[name];
	const pick = (k) => outer[k] ?? base[k];
	const abs = (p) => path.resolve(ROOT, p);
	const host = outer.HOST ?? '127.0.0.1';
	const port = pick('PORT');
	const e = {
		HOST: host,
		PORT: port,
		ORIGIN: outer.ORIGIN ?? `http://${host}:${port}`,
		DB_HOST: '127.0.0.1',
		DB_PORT: pick('DB_PORT'),
		DB_NAME: pick('DB_NAME'),
		DB_USER: outer.DB_USER ?? 'squishline',
		DB_PASSWORD: outer.DB_PASSWORD ?? 'squishline-local',
		// Migrations and seeding run as this owner account; the app's own account (above) gets
		// only the grants the migrations give it (the moderation log: no UPDATE or DELETE).
		DB_OWNER_USER: outer.DB_OWNER_USER ?? 'squishline_owner',
		DB_OWNER_PASSWORD: outer.DB_OWNER_PASSWORD ?? 'squishline-owner-local',
		DB_DATA_DIR: abs(pick('DB_DATA_DIR')),
		S3_PORT: pick('S3_PORT'),
		S3_DATA_DIR: abs(pick('S3_DATA_DIR')),
		S3_BUCKET: outer.S3_BUCKET ?? 'squishline',
		S3_REGION: outer.S3_REGION ?? 'us-east-1',
		S3_ACCESS_KEY_ID: outer.S3_ACCESS_KEY_ID ?? 'S3RVER',
		S3_SECRET_ACCESS_KEY: outer.S3_SECRET_ACCESS_KEY ?? 'S3RVER',
		SMTP_PORT: pick('SMTP_PORT'),
		FAKE_MAIL_DIR: abs(pick('FAKE_MAIL_DIR')),
		BUILD_DIR: abs(pick('BUILD_DIR')),
		RUN_DIR: abs(pick('RUN_DIR')),
		// The largest body any route takes (a 15 MB photo in its envelope); routes cap lower.
		BODY_SIZE_LIMIT: outer.BODY_SIZE_LIMIT ?? '16M',
		AUTH_TRUST_HOST: 'true',
		// This launcher runs the demo: fakes, demo accounts and the outbox page. Never production.
		SQUISHLINE_DEMO: '1',
		// The SDK is pinned to a release that supports Node 20; its reminder about Node 22 is noise here.
		AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED:
			outer.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ?? 'true',
		// The test and benchmark databases start empty each run (the benchmark seeds its own), unless
		// PERF_KEEP_DATA=1 asks the benchmark to time again what it seeded last time.
		FRESH_DB:
			(name === 'test' && outer.KEEP_TEST_DB !== '1') ||
			(name === 'perf' && outer.PERF_KEEP_DATA !== '1')
				? '1'
				: '',
		// Every browser test signs in from 127.0.0.1; the security suite checks the real limit
		// on a production entry of its own.
		SIGNIN_ATTEMPTS_PER_ADDRESS:
			name === 'test' ? '1000' : (outer.SIGNIN_ATTEMPTS_PER_ADDRESS ?? '')
	};
	if (base.APP_PORT) {
		Object.assign(e, {
			APP_PORT: pick('APP_PORT'),
			APP_PROCESSES: outer.APP_PROCESSES ?? '2',
			DB_REPLICA_HOST: '127.0.0.1',
			DB_REPLICA_PORT: pick('DB_REPLICA_PORT'),
			DB_REPLICA_DATA_DIR: abs(pick('DB_REPLICA_DATA_DIR')),
			DB_REPL_USER: outer.DB_REPL_USER ?? 'squishline_repl',
			DB_REPL_PASSWORD: outer.DB_REPL_PASSWORD ?? 'squishline-repl-local',
			// nginx is the edge: it sets X-Forwarded-For to the peer's address, the last entry.
			ADDRESS_HEADER: outer.ADDRESS_HEADER ?? 'x-forwarded-for',
			XFF_DEPTH: outer.XFF_DEPTH ?? '1',
			EDGE_CACHE_SECONDS: outer.EDGE_CACHE_SECONDS ?? '10',
			// The fault tests start from nothing each run; the demo keeps its data.
			WIPE_DB: name === 'cluster-test' ? '1' : ''
		});
		e.FRESH_DB = '';
		e.SIGNIN_ATTEMPTS_PER_ADDRESS = outer.SIGNIN_ATTEMPTS_PER_ADDRESS ?? '';
	}
	e.S3_ENDPOINT = outer.S3_ENDPOINT ?? `http://127.0.0.1:${e.S3_PORT}`;
	e.SMTP_URL = outer.SMTP_URL ?? `smtp://127.0.0.1:${e.SMTP_PORT}`;
	// Auth.js builds its links from this, never from a request's Host or X-Forwarded-Host.
	e.AUTH_URL = `${e.ORIGIN}/auth`;
	return e;
}

/** The same stack as the owner account: for migrations, seeding and the benchmark's loader. */
export function ownerEnv(e) {
	// The owner's work (migrations, seeding) reads what it just wrote: the primary only.
	const rest = { ...e };
	delete rest.DB_REPLICA_HOST;
	delete rest.DB_REPLICA_PORT;
	return {
		...rest,
		DB_USER: e.DB_OWNER_USER,
		DB_PASSWORD: e.DB_OWNER_PASSWORD,
		DB_APP_USER: e.DB_USER,
		DB_APP_HOST: '127.0.0.1'
	};
}

/** The variables stackEnv sets, so a nested launcher can be given a clean environment. */
export const STACK_KEYS = [
	...Object.keys(DEFAULTS.app),
	'HOST',
	'ORIGIN',
	'S3_ENDPOINT',
	'SMTP_URL',
	'AUTH_URL',
	'FRESH_DB',
	'APP_PROCESSES',
	'DB_REPLICA_HOST',
	'DB_REPL_USER',
	'DB_REPL_PASSWORD',
	'ADDRESS_HEADER',
	'XFF_DEPTH',
	'EDGE_CACHE_SECONDS',
	'WIPE_DB',
	'SIGNIN_ATTEMPTS_PER_ADDRESS',
	'SQUISHLINE_DEMO',
	'AUTH_TRUST_HOST',
	'BODY_SIZE_LIMIT'
];

export { ROOT };
