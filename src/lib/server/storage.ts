import { HeadBucketCommand, S3Client } from '@aws-sdk/client-s3';
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
