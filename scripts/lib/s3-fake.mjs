// The local S3-compatible object store (s3rver) that `npm start` and `npm test` run on loopback, so
// photos go through the same S3 API a hosted store answers. Its objects live in a folder under .data.
import { mkdirSync } from 'node:fs';
import S3rver from 's3rver';

// The AWS SDK warns on every start that its releases after January 2027 will need Node 22; the lock
// file pins this release, so the warning says nothing about the code that runs here.
const QUIET_SDK = { AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true' };
Object.assign(process.env, QUIET_SDK);

/** s3rver's fixed credentials; any other pair is refused by it. */
const KEY = 'S3RVER';

/**
 * Starts s3rver in this process on 127.0.0.1:port with its data in `dir`, with `bucket` created.
 * Resolves to the SHEDWRIGHT_S3_* settings that reach it and a stop().
 */
export async function startS3Fake({ port, dir, bucket }) {
  mkdirSync(dir, { recursive: true });
  const server = new S3rver({ address: '127.0.0.1', port, directory: dir, silent: true, configureBuckets: [{ name: bucket }] });
  const { port: actual } = await server.run();
  return {
    port: actual,
    env: {
      ...QUIET_SDK,
      SHEDWRIGHT_S3_ENDPOINT: `http://127.0.0.1:${actual}`,
      SHEDWRIGHT_S3_BUCKET: bucket,
      SHEDWRIGHT_S3_ACCESS_KEY_ID: KEY,
      SHEDWRIGHT_S3_SECRET_ACCESS_KEY: KEY,
    },
    stop: () => server.close(),
  };
}
