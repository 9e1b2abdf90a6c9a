import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { apiErrorBodySchema } from '@heatfleet/domain';
import { repoRoot, migrateLatest } from '@heatfleet/api/db/migrations.ts';
import { killMariadb, startMariadb, stopMariadb } from '@heatfleet/devstack/src/mariadb.ts';
import { createTestApp, signUpFirm, type TestApp } from './support/test-app.ts';

// A throwaway MariaDB of this test's own, so killing it disturbs no other test.
const dataDir = path.join(repoRoot, '.data', 'test', 'outage-db');
const port = 3417;
const dbName = 'heatfleet_outage';
const env = { DATABASE_PORT: String(port), DATABASE_NAME: dbName };

async function startDb() {
  await startMariadb({
    dataDir,
    port,
    dbName,
    user: process.env.DATABASE_USER,
    password: process.env.DATABASE_PASSWORD,
  });
}

let first: TestApp;
beforeAll(async () => {
  await startDb();
  first = createTestApp({ env });
  await migrateLatest(first.deps.db);
}, 120_000);
afterAll(async () => {
  await first?.close();
  await stopMariadb({ dataDir }).catch(() => undefined);
});

describe('when MariaDB goes away', () => {
  it('answers 503 with the error body (never a crash), and recovers when it returns', async () => {
    const { client } = await signUpFirm(first.app, 'outage', 'Outage Test Heating');
    await client.get('/api/me').expect(200);

    await killMariadb({ dataDir });
    for (const url of ['/api/me', '/api/members', '/api/health']) {
      const began = Date.now();
      const res = await client.get(url);
      expect(res.status, url).toBe(503);
      expect(Date.now() - began, `${url} answered within 5 s`).toBeLessThan(5000);
      const body = apiErrorBodySchema.parse(res.body);
      expect(body.error).toBe('ServiceUnavailable');
      expect(body.message).toMatch(/cannot reach its database/);
      expect(JSON.stringify(body)).not.toMatch(/ECONNREFUSED|mysql|stack/i);
      expect(res.headers['retry-after']).toBe('10');
    }
    const write = await client.post('/api/invitations', { email: 'outage-invitee@test.example', role: 'engineer' });
    expect(write.status).toBe(503);

    // An app that boots while the database is down must come good too (the session store's own
    // table check would otherwise stay rejected for the life of the process).
    const bootedDuringOutage = createTestApp({ env });
    try {
      expect((await request(bootedDuringOutage.app).get('/api/auth/csrf')).status).toBe(503);
      await startDb();
      await client.get('/api/me').expect(200);
      expect((await client.get('/api/members')).body.members).toHaveLength(1);
      await request(bootedDuringOutage.app).get('/api/auth/csrf').expect(200);
      await request(bootedDuringOutage.app).get('/api/health').expect(200);
    } finally {
      await bootedDuringOutage.close();
    }
  }, 120_000);
});
