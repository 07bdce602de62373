// The local S3-compatible fake (s3rver) on loopback, with the bucket created.
import { mkdirSync } from 'node:fs';
import S3rver from 's3rver';

export interface FakeS3 {
  endpoint: string;
  close(): Promise<void>;
}

export async function startFakeS3(options: { directory: string; port: number; bucket: string }): Promise<FakeS3> {
  mkdirSync(options.directory, { recursive: true });
  const server = new S3rver({
    address: '127.0.0.1',
    port: options.port,
    silent: true,
    directory: options.directory,
    vhostBuckets: false,
    configureBuckets: [{ name: options.bucket, configs: [] }],
  });
  const address = (await server.run()) as { port: number };
  return {
    endpoint: `http://127.0.0.1:${address.port}`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
