import { detached } from '../db/context';
import { afterCommit } from '../db/transaction';
import {
	DeleteObjectCommand,
	GetObjectCommand,
	HeadBucketCommand,
	HeadObjectCommand,
	PutObjectCommand,
	S3Client
} from '@aws-sdk/client-s3';
import { error } from '@sveltejs/kit';
import { env } from '../env';

/** The object store did not answer in time, or answered with a fault of its own. */
export class StorageDown extends Error {
	constructor(cause: unknown) {
		super(`object store unavailable: ${cause instanceof Error ? cause.message : String(cause)}`);
		this.cause = cause;
	}
}

let client: S3Client | null = null;
let clientKey = '';

/**
 * The object store, through the real AWS SDK only: pointing S3_ENDPOINT, S3_BUCKET and the keys
 * at a real bucket is all it takes to leave the local fake. Every request has a time limit
 * (S3_TIMEOUT_MS, default 5 s) and one retry, so a store that is down or frozen fails a request
 * in seconds instead of holding it.
 */
export function storage(): { client: S3Client; bucket: string } {
	const e = env();
	const key = [e.S3_ENDPOINT, e.S3_REGION, e.S3_ACCESS_KEY_ID, e.S3_TIMEOUT_MS].join('|');
	if (!client || key !== clientKey) {
		client = new S3Client({
			endpoint: e.S3_ENDPOINT,
			region: e.S3_REGION,
			forcePathStyle: e.S3_FORCE_PATH_STYLE,
			credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
			// Without these the SDK frames uploads in chunks that S3-compatible fakes store verbatim.
			requestChecksumCalculation: 'WHEN_REQUIRED',
			responseChecksumValidation: 'WHEN_REQUIRED',
			requestHandler: {
				connectionTimeout: Math.min(3000, e.S3_TIMEOUT_MS),
				requestTimeout: e.S3_TIMEOUT_MS
			},
			maxAttempts: 2
		});
		clientKey = key;
	}
	return { client, bucket: e.S3_BUCKET };
}

const statusOf = (e: unknown) =>
	(e as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;

/** Sends one command; anything but a clear answer from the store (4xx) counts as the store down. */
async function call<T>(run: (c: S3Client, o: { abortSignal: AbortSignal }) => Promise<T>) {
	const { client } = storage();
	const limit = env().S3_TIMEOUT_MS * 3;
	try {
		return await run(client, { abortSignal: AbortSignal.timeout(limit) });
	} catch (e) {
		const status = statusOf(e);
		if (status !== undefined && status < 500) throw e;
		throw new StorageDown(e);
	}
}

export async function pingStorage(): Promise<void> {
	await call((c, o) => c.send(new HeadBucketCommand({ Bucket: storage().bucket }), o));
}

/** Objects under keys that are never reused: any cache may keep them for good. */
export const IMMUTABLE = 'public, max-age=31536000, immutable';

export async function putObject(
	key: string,
	body: Uint8Array,
	contentType: string,
	cacheControl?: string
): Promise<void> {
	const put = new PutObjectCommand({
		Bucket: storage().bucket,
		Key: key,
		Body: body,
		ContentType: contentType,
		ContentLength: body.byteLength,
		CacheControl: cacheControl
	});
	await call((c, o) => c.send(put, o));
}

/** The object's bytes as a web stream, or null when it does not exist. */
export async function getObject(
	key: string
): Promise<{ body: ReadableStream; contentType: string; length?: number } | null> {
	try {
		const get = new GetObjectCommand({ Bucket: storage().bucket, Key: key });
		const r = await call((c, o) => c.send(get, o));
		if (!r.Body) return null;
		return {
			body: r.Body.transformToWebStream(),
			contentType: r.ContentType ?? 'application/octet-stream',
			length: r.ContentLength
		};
	} catch (e) {
		if ((e as { name?: string }).name === 'NoSuchKey' || statusOf(e) === 404) return null;
		throw e;
	}
}

/** getObject for a route: a store that is down answers 503 with words, not a generic fault. */
export async function getObjectForReader(key: string) {
	try {
		return await getObject(key);
	} catch (e) {
		if (e instanceof StorageDown)
			error(503, 'Photo storage is unavailable just now. Try again in a minute.');
		throw e;
	}
}

export async function objectExists(key: string): Promise<boolean> {
	try {
		await call((c, o) => c.send(new HeadObjectCommand({ Bucket: storage().bucket, Key: key }), o));
		return true;
	} catch (e) {
		if (statusOf(e) === 404) return false;
		throw e;
	}
}

/** One request per key: DeleteObjects needs a Content-MD5 that not every S3-compatible store accepts. */
export async function deleteObjects(keys: string[]): Promise<void> {
	for (const Key of keys)
		await call((c, o) => c.send(new DeleteObjectCommand({ Bucket: storage().bucket, Key }), o));
}

// A write the store was still holding when we gave up can land later. Keys of failed uploads
// are deleted again after a while, so even a late write leaves nothing behind.
const LATE_DELETE_AFTER_MS = [60_000, 10 * 60_000];
const pendingLate = new Set<string>();

export function deleteLater(keys: string[]): void {
	for (const k of keys) pendingLate.add(k);
	LATE_DELETE_AFTER_MS.forEach((ms, i) => {
		const last = i === LATE_DELETE_AFTER_MS.length - 1;
		detached(() =>
			setTimeout(() => {
				// After the last try the keys are forgotten, so the set does not grow for ever.
				if (last) for (const k of keys) pendingLate.delete(k);
				void deleteNow(keys);
			}, ms).unref()
		);
	});
}

async function deleteNow(keys: string[]): Promise<void> {
	try {
		await deleteObjects(keys);
	} catch (e) {
		console.error('[storage] could not delete after a failed upload', keys, e);
	}
}

/** Runs the late deletes now (tests; a clean shutdown). */
export async function flushLateDeletes(): Promise<void> {
	const keys = [...pendingLate];
	pendingLate.clear();
	await deleteNow(keys);
}

/**
 * Deletes objects whose rows are being deleted, once that is committed (never for a change that
 * rolls back); if the store is down just then, later.
 */
export async function deleteAfterCommit(keys: string[]): Promise<void> {
	if (keys.length === 0) return;
	await afterCommit(() => deleteObjects(keys).catch(() => deleteLater(keys)));
}
