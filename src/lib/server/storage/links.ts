import { GetObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import { env } from '../env';

// Published photos reach readers straight from the object store by signed URL: no Node process
// streams them, and the store (or a CDN before it) serves them with the immutable Cache-Control
// they were stored with. The bucket stays private; a draft's photos are never signed.

/**
 * A signature stays the same for a window, so a page keeps the same bytes (its ETag holds) and a
 * browser its cached photo; it lasts two windows, so a link signed at the end of one still works.
 * A build the desk takes down keeps working links for at most this long; a deleted photo at once.
 */
export const WINDOW_S = 6 * 3600;

let signer: S3Client | null = null;
let signerKey = '';

/** Where browsers reach the store (S3_PUBLIC_URL, else S3_ENDPOINT): the origin CSP allows. */
export const publicStoreUrl = () => env().S3_PUBLIC_URL ?? env().S3_ENDPOINT;

function client(): S3Client {
	const e = env();
	const key = [publicStoreUrl(), e.S3_REGION, e.S3_ACCESS_KEY_ID].join('|');
	if (!signer || key !== signerKey) {
		signer = new S3Client({
			endpoint: publicStoreUrl(),
			region: e.S3_REGION,
			forcePathStyle: e.S3_FORCE_PATH_STYLE,
			credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY }
		});
		signerKey = key;
	}
	return signer;
}

/** A signed GET for an object, the same for every request within the window of `now`. */
export async function signedLink(key: string, now: Date): Promise<string> {
	const start = Math.floor(now.getTime() / 1000 / WINDOW_S) * WINDOW_S;
	return getSignedUrl(client(), new GetObjectCommand({ Bucket: env().S3_BUCKET, Key: key }), {
		expiresIn: 2 * WINDOW_S,
		signingDate: new Date(start * 1000)
	});
}
