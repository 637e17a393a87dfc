// Local stand-in for an S3 bucket. The app talks to it only through @aws-sdk/client-s3.
import fs from 'node:fs';
import S3rver from 's3rver';
import { exitWhenOrphaned } from '../scripts/lib/orphan-guard.js';

const port = Number(process.env.S3_PORT ?? 4569);
const directory = process.env.S3_DATA_DIR ?? new URL('./data', import.meta.url).pathname;
const bucket = process.env.S3_BUCKET ?? 'squishline';
fs.mkdirSync(directory, { recursive: true });

// Browsers upload straight to presigned URLs, so the bucket needs a CORS rule.
const cors = `<CORSConfiguration><CORSRule>
<AllowedOrigin>*</AllowedOrigin>
<AllowedMethod>GET</AllowedMethod><AllowedMethod>PUT</AllowedMethod><AllowedMethod>HEAD</AllowedMethod>
<AllowedHeader>*</AllowedHeader><ExposeHeader>ETag</ExposeHeader><MaxAgeSeconds>3000</MaxAgeSeconds>
</CORSRule></CORSConfiguration>`;

const server = new S3rver({
	address: '127.0.0.1',
	port,
	directory,
	silent: true,
	configureBuckets: [{ name: bucket, configs: [cors] }]
});

await server.run();
console.log(
	`fake object store on http://127.0.0.1:${port} (bucket ${bucket}, files in ${directory})`
);

const stop = () => server.close().finally(() => process.exit(0));
process.once('SIGTERM', stop);
process.once('SIGINT', stop);
exitWhenOrphaned(() => server.close());
