import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultRateLimits as defaultSignInLimits } from '@heatfleet/api/modules/auth/rate-limits.ts';
import { Client, createTestApp, signUpFirm, TEST_PASSWORD, uniqueEmail, type TestApp } from './support/test-app.ts';

const WRONG = 'definitely not it';

describe('failed sign-ins are rate limited (default limits)', () => {
  let t: TestApp;
  beforeAll(() => {
    t = createTestApp();
  });
  afterAll(() => t.close());

  it(`locks an account after ${defaultSignInLimits.perAccount} failures with 429 and Retry-After, even with the right password`, async () => {
    const { email } = await signUpFirm(t.app, 'limit-account');
    const client = new Client(t.app);
    for (let i = 0; i < defaultSignInLimits.perAccount; i += 1) {
      expect((await client.post('/api/auth/sign-in', { email, password: WRONG })).status).toBe(401);
    }
    const limited = await client.post('/api/auth/sign-in', { email, password: TEST_PASSWORD });
    expect(limited.status).toBe(429);
    expect(Number(limited.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(limited.headers['retry-after'])).toBeLessThanOrEqual(defaultSignInLimits.windowMs / 1000);
    expect(limited.body.error).toBe('TooManyRequests');
    // Another account from the same address is not affected by this account's lock.
    const other = await signUpFirm(t.app, 'limit-other');
    expect(
      (await new Client(t.app).post('/api/auth/sign-in', { email: other.email, password: TEST_PASSWORD })).status,
    ).toBe(200);
  });

  it('successful sign-ins do not count towards the limit', async () => {
    const { email } = await signUpFirm(t.app, 'limit-success');
    for (let i = 0; i < defaultSignInLimits.perAccount + 2; i += 1) {
      expect((await new Client(t.app).post('/api/auth/sign-in', { email, password: TEST_PASSWORD })).status).toBe(200);
    }
  });
});

describe('per address, and never for good', () => {
  it('limits one address trying many accounts, and lets the account in again after the window', async () => {
    const windowMs = 1500;
    const t = createTestApp({ limits: { windowMs, perAccount: 3, perAddress: 5, resetsPerAccount: 5 } });
    try {
      const victim = await signUpFirm(t.app, 'limit-victim');
      const attacker = new Client(t.app);
      for (let i = 0; i < 5; i += 1) {
        expect(
          (await attacker.post('/api/auth/sign-in', { email: uniqueEmail('spray'), password: WRONG })).status,
        ).toBe(401);
      }
      const sprayed = await attacker.post('/api/auth/sign-in', { email: uniqueEmail('spray'), password: WRONG });
      expect(sprayed.status).toBe(429);
      expect(sprayed.body.message).toMatch(/from this network/);
      // The lock is a window: once it passes the victim's right password works again.
      await new Promise((r) => setTimeout(r, windowMs + 200));
      expect(
        (await new Client(t.app).post('/api/auth/sign-in', { email: victim.email, password: TEST_PASSWORD })).status,
      ).toBe(200);
    } finally {
      await t.close();
    }
  });
});
