import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { apiErrorBodySchema } from '@heatfleet/domain';
import { apiRoutes } from '@heatfleet/api/routes/api-routes.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

describe('GET /api/openapi.json', () => {
  it('is an OpenAPI 3.1 document describing every registered route', async () => {
    const res = await request(t.app).get('/api/openapi.json').expect(200);
    expect(res.body.openapi).toBe('3.1.0');
    for (const route of apiRoutes) {
      const p = `/api${route.path.replace(/:([A-Za-z]+)/g, '{$1}')}`;
      expect(res.body.paths[p]?.[route.method], `${route.method} ${p}`).toBeDefined();
    }
  });

  it('describes request bodies from the same zod schemas the API enforces', async () => {
    const res = await request(t.app).get('/api/openapi.json').expect(200);
    const signUp = res.body.paths['/api/auth/sign-up'].post.requestBody.content['application/json'].schema;
    expect(signUp.required).toEqual(expect.arrayContaining(['firmName', 'name', 'email', 'password']));
    expect(signUp.properties.password.minLength).toBe(12);
    expect(signUp.properties.password.maxLength).toBe(128);
  });
});

describe('the error body', () => {
  it('an unknown API path answers 404 with the shared error body and a request id', async () => {
    const res = await request(t.app).get('/api/no-such-thing').expect(404);
    const body = apiErrorBodySchema.parse(res.body);
    expect(body.requestId).toBe(res.headers['x-request-id']);
  });

  it('an unknown query parameter is refused with 422 rather than ignored', async () => {
    const res = await request(t.app).get('/api/health?firm_id=1').expect(422);
    expect(apiErrorBodySchema.parse(res.body).details?.[0]?.message).toBeTruthy();
  });
});

describe('the Outbox', () => {
  it('exists outside production only', async () => {
    await request(t.app).get('/api/outbox').expect(200);
    const production = createTestApp({ env: { NODE_ENV: 'production' } });
    try {
      const res = await request(production.app).get('/api/outbox').expect(404);
      expect(apiErrorBodySchema.parse(res.body).error).toBe('NotFound');
    } finally {
      await production.close();
    }
  });
});
