// Photos and documents live in an S3 bucket (a local S3-compatible fake in development and
// tests, a real bucket in production: only the S3_* variables change).
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import type { Config } from '../config';
import { UnavailableError } from '../errors';

export interface ObjectStore {
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  get(key: string): Promise<Buffer>;
  remove(key: string): Promise<void>;
}

function unavailable(error: unknown): never {
  const status = (error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
  if (status === 404) throw Object.assign(new Error('object missing'), { code: 'NoSuchKey' });
  throw new UnavailableError('File storage is unavailable. Try again in a moment.');
}

export function createObjectStore(config: Pick<Config, 's3'>): ObjectStore {
  // The SDK warns that releases after January 2027 need Node 22; ours is pinned and runs on the
  // machine's Node 20, so the warning is noise in every log and test run.
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true';
  const client = new S3Client({
    // Without an endpoint the SDK talks to AWS itself (production with a real bucket).
    endpoint: config.s3.endpoint ?? undefined,
    region: config.s3.region,
    forcePathStyle: true,
    credentials: { accessKeyId: config.s3.accessKeyId, secretAccessKey: config.s3.secretAccessKey },
    maxAttempts: 2,
    requestHandler: { connectionTimeout: 1500, requestTimeout: 5000 },
  });
  const Bucket = config.s3.bucket;
  return {
    async put(key, body, contentType) {
      await client.send(new PutObjectCommand({ Bucket, Key: key, Body: body, ContentType: contentType })).catch(unavailable);
    },
    async get(key) {
      const result = await client.send(new GetObjectCommand({ Bucket, Key: key })).catch(unavailable);
      const bytes = await result.Body?.transformToByteArray();
      return Buffer.from(bytes ?? []);
    },
    async remove(key) {
      await client.send(new DeleteObjectCommand({ Bucket, Key: key })).catch(unavailable);
    },
  };
}
