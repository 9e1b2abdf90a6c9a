import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import type { Readable } from 'node:stream';
import type { Env } from '../config/env.ts';
import { HttpError } from './http-error.ts';

export interface ObjectStore {
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  get(key: string): Promise<Readable>;
  delete(key: string): Promise<void>;
}

const unavailable = () =>
  new HttpError(
    503,
    'Heatfleet cannot reach its file storage (photos and data sheets) just now. Nothing was saved; try again in a minute.',
    'ServiceUnavailable',
    undefined,
    { 'Retry-After': '30' },
  );

function isUnreachable(err: unknown): boolean {
  const e = err as { code?: string; name?: string; $metadata?: { httpStatusCode?: number } };
  return (
    ['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EHOSTUNREACH'].includes(e.code ?? '') ||
    e.name === 'TimeoutError' ||
    (e.$metadata?.httpStatusCode ?? 0) >= 500
  );
}

async function guard<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (err) {
    if (isUnreachable(err)) throw unavailable();
    if ((err as { name?: string }).name === 'NoSuchKey')
      throw new HttpError(404, 'That photo\u2019s file is missing from storage.');
    throw err;
  }
}

/** Object storage through the AWS SDK: s3rver locally, any S3-compatible store in production. */
export function createObjectStore(env: Env): ObjectStore {
  const client = new S3Client({
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION,
    forcePathStyle: env.S3_FORCE_PATH_STYLE,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
    maxAttempts: 2,
  });
  const Bucket = env.S3_BUCKET;
  return {
    put: (key, body, contentType) =>
      guard(
        async () =>
          void (await client.send(new PutObjectCommand({ Bucket, Key: key, Body: body, ContentType: contentType }))),
      ),
    get: (key) => guard(async () => (await client.send(new GetObjectCommand({ Bucket, Key: key }))).Body as Readable),
    delete: (key) => guard(async () => void (await client.send(new DeleteObjectCommand({ Bucket, Key: key })))),
  };
}
