import {
	DeleteObjectCommand,
	GetObjectCommand,
	HeadBucketCommand,
	HeadObjectCommand,
	PutObjectCommand,
	S3Client
} from '@aws-sdk/client-s3';
import { env } from './env';

let client: S3Client | null = null;
let clientKey = '';

/**
 * The object store, through the real AWS SDK only: pointing S3_ENDPOINT, S3_BUCKET and the keys
 * at a real bucket is all it takes to leave the local fake.
 */
export function storage(): { client: S3Client; bucket: string } {
	const e = env();
	const key = [e.S3_ENDPOINT, e.S3_REGION, e.S3_ACCESS_KEY_ID].join('|');
	if (!client || key !== clientKey) {
		client = new S3Client({
			endpoint: e.S3_ENDPOINT,
			region: e.S3_REGION,
			forcePathStyle: e.S3_FORCE_PATH_STYLE,
			credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
			// Without these the SDK frames uploads in chunks that S3-compatible fakes store verbatim.
			requestChecksumCalculation: 'WHEN_REQUIRED',
			responseChecksumValidation: 'WHEN_REQUIRED',
			maxAttempts: 1
		});
		clientKey = key;
	}
	return { client, bucket: e.S3_BUCKET };
}

export async function pingStorage(): Promise<void> {
	const { client, bucket } = storage();
	await client.send(new HeadBucketCommand({ Bucket: bucket }), {
		abortSignal: AbortSignal.timeout(3000)
	});
}

export async function putObject(key: string, body: Uint8Array, contentType: string): Promise<void> {
	const { client, bucket } = storage();
	await client.send(
		new PutObjectCommand({
			Bucket: bucket,
			Key: key,
			Body: body,
			ContentType: contentType,
			ContentLength: body.byteLength
		})
	);
}

/** The object's bytes as a web stream, or null when it does not exist. */
export async function getObject(
	key: string
): Promise<{ body: ReadableStream; contentType: string; length?: number } | null> {
	const { client, bucket } = storage();
	try {
		const r = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
		if (!r.Body) return null;
		return {
			body: r.Body.transformToWebStream(),
			contentType: r.ContentType ?? 'application/octet-stream',
			length: r.ContentLength
		};
	} catch (e) {
		if ((e as { name?: string }).name === 'NoSuchKey') return null;
		throw e;
	}
}

export async function objectExists(key: string): Promise<boolean> {
	const { client, bucket } = storage();
	try {
		await client.send(new HeadObjectCommand({ Bucket: bucket, Key: key }));
		return true;
	} catch (e) {
		const status = (e as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
		if (status === 404) return false;
		throw e;
	}
}

/** One request per key: DeleteObjects needs a Content-MD5 that not every S3-compatible store accepts. */
export async function deleteObjects(keys: string[]): Promise<void> {
	const { client, bucket } = storage();
	for (const Key of keys) await client.send(new DeleteObjectCommand({ Bucket: bucket, Key }));
}
