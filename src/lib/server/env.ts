import { z } from 'zod';

// Runtime configuration in one place. It reads process.env rather than $env/dynamic/private
// because the migration and seed scripts import the database layer outside Vite; adapter-node
// fills process.env from the real environment, so both paths see the same values.
const schema = z.object({
	ORIGIN: z.string().default('http://127.0.0.1:3000'),
	DB_HOST: z.string().default('127.0.0.1'),
	DB_PORT: z.coerce.number().int().positive().default(3307),
	DB_NAME: z.string().default('squishline'),
	DB_USER: z.string().default('squishline'),
	DB_PASSWORD: z.string().default('squishline-local'),
	/** TLS to the database: "true" to require it; DB_TLS_CA names a CA file when it is private. */
	DB_TLS: z
		.enum(['true', 'false'])
		.default('false')
		.transform((v) => v === 'true'),
	DB_TLS_CA: z.string().optional(),
	/** A read replica (MariaDB GTID replication): reads outside transactions go there. */
	DB_REPLICA_HOST: z.string().optional(),
	DB_REPLICA_PORT: z.coerce.number().int().positive().optional(),
	/** After a failed read, the replica is left alone this long (reads go to the primary). */
	DB_REPLICA_PAUSE_S: z.coerce.number().positive().default(5),
	/** A replica further behind than this (seconds) is read from no more until it catches up. */
	DB_REPLICA_MAX_LAG_S: z.coerce.number().positive().default(5),
	/** How long a member's next page waits for the replica to reach their own write. */
	DB_REPLICA_WAIT_MS: z.coerce.number().int().nonnegative().default(500),
	/** Set when running migrations as the owner account: the account whose grants they set. */
	DB_APP_USER: z.string().optional(),
	DB_APP_HOST: z.string().default('127.0.0.1'),
	S3_ENDPOINT: z.string().default('http://127.0.0.1:4569'),
	S3_REGION: z.string().default('us-east-1'),
	S3_BUCKET: z.string().default('squishline'),
	S3_ACCESS_KEY_ID: z.string().default('S3RVER'),
	S3_SECRET_ACCESS_KEY: z.string().default('S3RVER'),
	S3_FORCE_PATH_STYLE: z
		.enum(['true', 'false'])
		.default('true')
		.transform((v) => v === 'true'),
	/**
	 * The object store's address as readers' browsers reach it (published photos are linked there
	 * by signed URL); the same as S3_ENDPOINT unless a CDN or another name stands in front.
	 */
	S3_PUBLIC_URL: z.string().url().optional(),
	/** Time limit of one object-store request, in ms; each is tried twice. */
	S3_TIMEOUT_MS: z.coerce.number().int().positive().default(5000),
	SMTP_URL: z.string().default('smtp://127.0.0.1:2525'),
	MAIL_FROM: z.string().default('Squishline <bench@squishline.test>'),
	/** Folder the local fake mail server writes to; the outbox page reads it in the demo only. */
	FAKE_MAIL_DIR: z.string().optional(),
	/**
	 * Set to "1" by the local launcher (npm start, npm test, npm run dev) and nothing else: the
	 * demo's conveniences (the outbox page) exist only then. The production entry clears it.
	 */
	SQUISHLINE_DEMO: z
		.string()
		.optional()
		.transform((v) => v === '1'),
	AUTH_SECRET: z.string().optional(),
	/** How long an edge cache (nginx, a CDN) may keep a public answer (s-maxage); 0: not at all. */
	EDGE_CACHE_SECONDS: z.coerce.number().int().nonnegative().default(0),
	/** Memory each process may give to whole anonymous answers (web/kept-answers.ts); 0: none. */
	KEPT_ANSWERS_MB: z.coerce.number().nonnegative().default(64)
});

export type Env = z.infer<typeof schema>;

/** Parsed on every call: cheap, and tests can point a module at another service by changing process.env. */
export function env(): Env {
	return schema.parse(process.env);
}
