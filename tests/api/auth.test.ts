import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { apiErrorBodySchema } from '@heatfleet/domain';
import {
  Client,
  createTestApp,
  signIn,
  signUpFirm,
  TEST_PASSWORD,
  uniqueEmail,
  type TestApp,
} from './support/test-app.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

function cookieOf(res: request.Response): string {
  const raw = res.headers['set-cookie'] as unknown as string[] | undefined;
  const cookie = raw?.find((c) => c.startsWith('heatfleet.sid='));
  if (!cookie) throw new Error('no session cookie set');
  return cookie;
}

describe('sign-up', () => {
  it('creates a firm with the person as its Owner, signed in', async () => {
    const { client, email } = await signUpFirm(t.app, 'signup', 'Sign-up Test Heating');
    const me = await client.get('/api/me').expect(200);
    expect(me.body.me.user.email).toBe(email);
    expect(me.body.me.role).toBe('owner');
    expect(me.body.me.activeFirm.name).toBe('Sign-up Test Heating');
    expect(me.body.me.activeFirm.timeZone).toBe('Europe/London');
  });

  it('stores the password as argon2id at no less than OWASP minimum (m=19 MiB, t=2, p=1)', async () => {
    // Source: OWASP Password Storage Cheat Sheet, argon2id minimum configuration.
    const { userId } = await signUpFirm(t.app, 'hash');
    const row = await t.deps.db('users').where({ id: userId }).first('password_hash');
    const match = /^\$argon2id\$v=19\$m=(\d+),t=(\d+),p=(\d+)\$/.exec(row.password_hash);
    expect(match).not.toBeNull();
    const [, m, tCost, p] = match!.map(Number);
    expect(m).toBeGreaterThanOrEqual(19 * 1024);
    expect(tCost).toBeGreaterThanOrEqual(2);
    expect(p).toBeGreaterThanOrEqual(1);
    expect(row.password_hash).not.toContain(TEST_PASSWORD);
  });

  it('refuses a password under 12 or over 128 characters with the field named, and creates nothing', async () => {
    const client = new Client(t.app);
    const email = uniqueEmail('short');
    const short = await client.post('/api/auth/sign-up', {
      firmName: 'Short Ltd',
      name: 'A',
      email,
      password: 'elevenchars',
    });
    expect(short.status).toBe(422);
    expect(apiErrorBodySchema.parse(short.body).details).toEqual([
      { path: 'password', message: 'Password must be at least 12 characters.' },
    ]);
    const long = await client.post('/api/auth/sign-up', {
      firmName: 'Long Ltd',
      name: 'A',
      email,
      password: 'x'.repeat(129),
    });
    expect(long.status).toBe(422);
    expect(await t.deps.db('users').where({ email }).first()).toBeUndefined();
  });

  it('accepts a 12-character password with no composition rules (NIST SP 800-63B)', async () => {
    const client = new Client(t.app);
    const res = await client.post('/api/auth/sign-up', {
      firmName: 'Plain Ltd',
      name: 'A',
      email: uniqueEmail('plain'),
      password: 'lowercase only words',
    });
    expect(res.status).toBe(202);
  });

  it('a signed-in person adds a firm from their account and the firm switcher lists both', async () => {
    const { client } = await signUpFirm(t.app, 'dupe', 'First Dupe Heating');
    const res = await client.post('/api/me/firms', { firmName: 'Second Dupe Heating' });
    expect(res.status).toBe(201);
    expect(res.body.me.activeFirm.name).toBe('Second Dupe Heating');
    expect(res.body.me.role).toBe('owner');
    expect(res.body.me.memberships.map((m: { firmName: string }) => m.firmName).sort()).toEqual([
      'First Dupe Heating',
      'Second Dupe Heating',
    ]);
    expect((await client.get('/api/me')).body.me.activeFirm.name).toBe('Second Dupe Heating');
  });

  it('answers 422, not a database error, when an object is sent where a string is expected', async () => {
    const res = await new Client(t.app).post('/api/auth/sign-up', {
      firmName: { $gt: '' },
      name: 'A',
      email: uniqueEmail('obj'),
      password: TEST_PASSWORD,
    });
    expect(res.status).toBe(422);
    expect(res.body.details[0].path).toBe('firmName');
    expect(JSON.stringify(res.body)).not.toMatch(/sql|ER_|stack/i);
  });

  it('answers 400 with the error body for malformed JSON', async () => {
    const client = new Client(t.app);
    await client.refreshCsrf();
    const res = await client.agent
      .post('/api/auth/sign-in')
      .set('X-CSRF-Token', client.csrfToken)
      .set('Content-Type', 'application/json')
      .send('{"email":');
    expect(res.status).toBe(400);
    expect(apiErrorBodySchema.parse(res.body).message).toBe('The request body is not valid JSON.');
  });
});

describe('sign-in', () => {
  it('answers the same for an unknown e-mail and a wrong password', async () => {
    const { email } = await signUpFirm(t.app, 'same');
    const wrong = await new Client(t.app).post('/api/auth/sign-in', { email, password: 'not the password at all' });
    const unknown = await new Client(t.app).post('/api/auth/sign-in', {
      email: uniqueEmail('nobody'),
      password: 'not the password at all',
    });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    const strip = (b: Record<string, unknown>) => ({ ...b, requestId: undefined });
    expect(strip(wrong.body)).toEqual(strip(unknown.body));
  });

  it('regenerates the session id at sign-in and sets HttpOnly, SameSite=Lax, no Secure over plain HTTP', async () => {
    const { email } = await signUpFirm(t.app, 'regen');
    const client = new Client(t.app);
    const before = cookieOf(await client.agent.get('/api/auth/csrf'));
    client.csrfToken = '';
    const res = await client.post('/api/auth/sign-in', { email, password: TEST_PASSWORD });
    const after = cookieOf(res);
    expect(after.split(';')[0]).not.toBe(before.split(';')[0]);
    expect(after).toMatch(/HttpOnly/i);
    expect(after).toMatch(/SameSite=Lax/i);
    expect(after).not.toMatch(/Secure/i);
  });

  it('marks the cookie Secure when served over HTTPS behind a trusted proxy', async () => {
    const proxied = createTestApp({ env: { TRUST_PROXY: '1' } });
    try {
      const res = await request(proxied.app).get('/api/auth/csrf').set('X-Forwarded-Proto', 'https');
      expect(cookieOf(res)).toMatch(/Secure/i);
    } finally {
      await proxied.close();
    }
  });

  it('signing out ends the session on the server, so the old cookie no longer works', async () => {
    const { email } = await signUpFirm(t.app, 'out');
    const client = new Client(t.app);
    const cookie = cookieOf(await client.post('/api/auth/sign-in', { email, password: TEST_PASSWORD })).split(';')[0]!;
    await request(t.app).get('/api/me').set('Cookie', cookie).expect(200);
    await client.post('/api/auth/sign-out').then((r) => expect(r.status).toBe(204));
    await request(t.app).get('/api/me').set('Cookie', cookie).expect(401);
  });
});

describe('session lifetime (enforced on the server with an injected clock)', () => {
  it('ends a session idle for longer than the idle timeout', async () => {
    const app = createTestApp({ env: { SESSION_IDLE_MINUTES: '30' } });
    try {
      const { client } = await signUpFirm(app.app, 'idle');
      app.clock.advance(29 * 60 * 1000);
      await client.get('/api/me').expect(200);
      app.clock.advance(31 * 60 * 1000);
      const res = await client.get('/api/me');
      expect(res.status).toBe(401);
      expect(res.body.message).toMatch(/session has ended/);
    } finally {
      await app.close();
    }
  });

  it('ends a session older than its absolute lifetime even when it was kept busy', async () => {
    const app = createTestApp({ env: { SESSION_IDLE_MINUTES: '60', SESSION_ABSOLUTE_HOURS: '2' } });
    try {
      const { client } = await signUpFirm(app.app, 'absolute');
      for (let i = 0; i < 3; i += 1) {
        app.clock.advance(50 * 60 * 1000);
        const res = await client.get('/api/me');
        expect(res.status).toBe(i < 2 ? 200 : 401);
      }
    } finally {
      await app.close();
    }
  });
});

describe('password change', () => {
  it('ends the person\u2019s other sessions and keeps the current one', async () => {
    const { email, client: first } = await signUpFirm(t.app, 'change');
    const second = await signIn(t.app, email);
    const res = await first.put('/api/me/password', {
      currentPassword: TEST_PASSWORD,
      newPassword: 'a brand new passphrase',
    });
    expect(res.status).toBe(200);
    await first.get('/api/me').expect(200);
    await second.get('/api/me').expect(401);
    await signIn(t.app, email, 'a brand new passphrase');
  });

  it('refuses a wrong current password next to that field', async () => {
    const { client } = await signUpFirm(t.app, 'change-wrong');
    const res = await client.put('/api/me/password', {
      currentPassword: 'wrong wrong wrong',
      newPassword: 'a brand new passphrase',
    });
    expect(res.status).toBe(422);
    expect(res.body.details[0].path).toBe('currentPassword');
  });
});

describe('CSRF and origin', () => {
  it('refuses a state-changing request without the token, and changes nothing', async () => {
    const { client, firmId } = await signUpFirm(t.app, 'csrf');
    const email = uniqueEmail('csrf-invitee');
    const res = await client.agent.post('/api/invitations').send({ email, role: 'engineer' });
    expect(res.status).toBe(403);
    expect(res.body.error).toBe('CsrfTokenInvalid');
    expect(await t.deps.db('invitations').where({ firm_id: firmId, email }).first()).toBeUndefined();
  });

  it('refuses a request from a foreign Origin even with the right token', async () => {
    const { client, firmId } = await signUpFirm(t.app, 'origin');
    const email = uniqueEmail('origin-invitee');
    const res = await client.agent
      .post('/api/invitations')
      .set('X-CSRF-Token', client.csrfToken)
      .set('Origin', 'https://elsewhere.example')
      .send({ email, role: 'engineer' });
    expect(res.status).toBe(403);
    expect(await t.deps.db('invitations').where({ firm_id: firmId, email }).first()).toBeUndefined();
  });

  it('sends a strict Content-Security-Policy and nosniff', async () => {
    const res = await request(t.app).get('/api/health').expect(200);
    const csp = res.headers['content-security-policy'];
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("base-uri 'none'");
    expect(csp).not.toMatch(/https?:/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
  });
});

describe('firm switcher', () => {
  it('acts in the active firm only, and refuses a firm the person is not in with 404', async () => {
    const a = await signUpFirm(t.app, 'switch', 'Switch One');
    const second = await a.client.post('/api/me/firms', { firmName: 'Switch Two' });
    const secondFirmId = second.body.me.activeFirm.id as number;
    const other = await signUpFirm(t.app, 'switch-other');
    const client = await signIn(t.app, a.email);
    const switched = await client.put('/api/me/active-firm', { firmId: secondFirmId });
    expect(switched.status).toBe(200);
    expect(switched.body.me.activeFirm.name).toBe('Switch Two');
    const members = await client.get('/api/members').expect(200);
    expect(members.body.members.every((m: { firmId: number }) => m.firmId === secondFirmId)).toBe(true);
    const refused = await client.put('/api/me/active-firm', { firmId: other.firmId });
    expect(refused.status).toBe(404);
    expect((await client.get('/api/me')).body.me.activeFirm.id).toBe(secondFirmId);
  });
});
