import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiErrorBodySchema } from '@heatfleet/domain';
import { createTestApp, signUpFirm, type TestApp } from './support/test-app.ts';

// Nothing listens on port 1: the same refusal the API meets when the object store is down.
let t: TestApp;
beforeAll(() => {
  t = createTestApp({ env: { S3_ENDPOINT: 'http://127.0.0.1:1' } });
});
afterAll(() => t.close());

const tinyPng = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==',
  'base64',
);

describe('when the object store is down', () => {
  it('refuses an upload with a 503 in plain words and writes no row', async () => {
    const { client, firmId } = await signUpFirm(t.app, 'store-down', 'Store Down Heating');
    const began = Date.now();
    const res = await client.upload(
      '/api/photos',
      { caption: 'Rig before cleaning' },
      { field: 'photo', content: tinyPng, filename: 'rig.png', contentType: 'image/png' },
    );
    expect(res.status).toBe(503);
    expect(Date.now() - began).toBeLessThan(5_000);
    const body = apiErrorBodySchema.parse(res.body);
    expect(body.error).toBe('ServiceUnavailable');
    expect(body.message).toBe(
      'Heatfleet cannot reach its file storage (photos and data sheets) just now. Nothing was saved; try again in a minute.',
    );
    expect(JSON.stringify(body)).not.toMatch(/ECONNREFUSED|127\.0\.0\.1|stack/i);
    expect(res.headers['retry-after']).toBe('30');
    expect(await t.deps.db('photos').where({ firm_id: firmId }).count({ n: '*' }).first()).toEqual({ n: 0 });
  });
});
