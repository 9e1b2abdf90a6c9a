import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { afterAll, describe, expect, it } from 'vitest';
import { startObjectStore } from './object-store.ts';

// Port 0 would do for s3rver, but the client needs the endpoint before the first request: a fixed spare port.
const port = 4579;
const bucket = 'heatfleet-photos';

function clientFor(endpoint: string): S3Client {
  return new S3Client({
    endpoint,
    region: 'eu-west-2',
    forcePathStyle: true,
    credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
  });
}

describe('startObjectStore', () => {
  const dataDir = mkdtempSync(join(tmpdir(), 'heatfleet-s3-'));
  afterAll(() => rmSync(dataDir, { recursive: true, force: true }));

  it('serves the bucket it made, and keeps objects across a restart', async () => {
    const first = await startObjectStore({ port, dataDir, bucket });
    const client = clientFor(first.endpoint);
    try {
      await client.send(
        new PutObjectCommand({
          Bucket: bucket,
          Key: 'firm-1/photo.png',
          Body: 'not really a png',
          ContentType: 'image/png',
        }),
      );
    } finally {
      await first.close();
    }

    const second = await startObjectStore({ port, dataDir, bucket });
    try {
      const got = await client.send(new GetObjectCommand({ Bucket: bucket, Key: 'firm-1/photo.png' }));
      expect(await got.Body?.transformToString()).toBe('not really a png');
      expect(got.ContentType).toBe('image/png');
    } finally {
      client.destroy();
      await second.close();
    }
  });

  it('says which port is taken', async () => {
    const store = await startObjectStore({ port, dataDir, bucket });
    try {
      await expect(startObjectStore({ port, dataDir, bucket })).rejects.toThrow(
        /4579 \(S3 object store\) is already in use/,
      );
    } finally {
      await store.close();
    }
  });
});
