import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, createTestApp, signUpFirm, TEST_PASSWORD, uniqueEmail, type TestApp } from './support/test-app.ts';

const WRONG = 'definitely not it';
const perAccount = 3;

async function failSignIn(t: TestApp, email: string): Promise<number> {
  return (await new Client(t.app).post('/api/auth/sign-in', { email, password: WRONG })).status;
}

// Several API replicas behind one balancer must give an attacker no more guesses than one replica would
// (OWASP Authentication Cheat Sheet, "Protect against automated attacks": limits per account, server side).
describe('the failed-sign-in limit is shared by every replica (counts on Redis)', () => {
  const replicas: TestApp[] = [];
  beforeAll(() => {
    const shared = { RATE_LIMIT_PREFIX: `hf:rl:replicas-${randomUUID()}:` };
    for (let i = 0; i < 3; i += 1) replicas.push(createTestApp({ env: shared, limits: { perAccount } }));
  });
  afterAll(() => Promise.all(replicas.map((r) => r.close())));

  it(`spreads ${perAccount} failures over three replicas, then every replica answers 429`, async () => {
    const { email } = await signUpFirm(replicas[0]!.app, 'replica-limit');
    for (let i = 0; i < perAccount; i += 1) expect(await failSignIn(replicas[i % 3]!, email)).toBe(401);
    for (const replica of replicas) {
      const res = await new Client(replica.app).post('/api/auth/sign-in', { email, password: TEST_PASSWORD });
      expect(res.status).toBe(429);
      expect(res.body.error).toBe('TooManyRequests');
    }
  });

  it('keeps accounts apart: another account on the same replicas is not limited', async () => {
    const { email } = await signUpFirm(replicas[1]!.app, 'replica-other');
    expect(await failSignIn(replicas[2]!, uniqueEmail('replica-nobody'))).toBe(401);
    const res = await new Client(replicas[0]!.app).post('/api/auth/sign-in', { email, password: TEST_PASSWORD });
    expect(res.status).toBe(200);
  });

  it('would give three times the guesses with per-process counting (the gap the shared store closes)', async () => {
    const separate = [0, 1, 2].map(() => createTestApp({ limits: { perAccount } }));
    try {
      const { email } = await signUpFirm(separate[0]!.app, 'replica-separate');
      for (const replica of separate) {
        for (let i = 0; i < perAccount; i += 1) expect(await failSignIn(replica, email)).toBe(401);
      }
    } finally {
      await Promise.all(separate.map((r) => r.close()));
    }
  });
});

describe('with Redis unreachable the limiter counts in the process instead', () => {
  let t: TestApp;
  let withRedis: TestApp;
  beforeAll(() => {
    // Port 1 on loopback: nothing listens, so every Redis command fails at once.
    t = createTestApp({ env: { REDIS_URL: 'redis://127.0.0.1:1' }, limits: { perAccount } });
    withRedis = createTestApp();
  });
  afterAll(() => Promise.all([t.close(), withRedis.close()]));

  it('still signs people in and still limits failures (never a 500, never unlimited)', async () => {
    // Signed up where Redis answers: queueing the confirmation e-mail is not what this test is about.
    const { email } = await signUpFirm(withRedis.app, 'replica-no-redis');
    expect((await new Client(t.app).post('/api/auth/sign-in', { email, password: TEST_PASSWORD })).status).toBe(200);
    for (let i = 0; i < perAccount; i += 1) expect(await failSignIn(t, email)).toBe(401);
    expect(await failSignIn(t, email)).toBe(429);
  });

  it('says so in the health check, and still answers 200 while the database answers', async () => {
    const res = await new Client(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', database: 'reachable', redis: 'unreachable' });
  });
});
