// A fake S3 server for the tests (s3rver, from npm), on loopback with its own folder.
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { root } from './env.mjs';

/** Starts s3rver on 127.0.0.1:port with the bucket; resolves to { close }. Throws EADDRINUSE if taken. */
export async function startFakeS3({ port, bucket, dir = path.join(root, '.data', 's3-test') }) {
  const { default: S3rver } = await import('s3rver');
  mkdirSync(dir, { recursive: true });
  const server = new S3rver({
    address: '127.0.0.1',
    port,
    silent: true,
    directory: dir,
    resetOnClose: true,
    configureBuckets: [{ name: bucket }],
  });
  await server.run();
  return { close: () => server.close() };
}
