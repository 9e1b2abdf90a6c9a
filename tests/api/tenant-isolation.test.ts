import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiRoutes } from '@heatfleet/api/routes/api-routes.ts';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { allTables, seedFirm, snapshotFirm, tenantTables, type SeededFirm } from './support/seed-firm.ts';
import { callProbe, routeKey } from './support/route-probes.ts';

/**
 * Routes that touch no firm's records, each with the reason. Every other route is called by a
 * member of firm B with firm A's ids and must answer 404 or with B's data only.
 */
const notTenantData: Record<string, string> = {
  'GET /health': 'liveness only',
  'GET /openapi.json': 'the API description',
  'GET /auth/csrf': 'the caller\u2019s own session token',
  'POST /auth/sign-up': 'e-mails a link; no firm exists until it is confirmed',
  'POST /auth/sign-up/confirm': 'addressed by a secret token, not an id; creates a new firm',
  'POST /me/firms': 'creates a new firm of the caller\u2019s own',
  'POST /auth/sign-in': 'the caller\u2019s own account',
  'POST /auth/sign-out': 'the caller\u2019s own session',
  'POST /auth/password-reset': 'answers the same for any e-mail',
  'POST /auth/password-reset/confirm': 'addressed by a secret token, not an id',
  'GET /me': 'the caller\u2019s own account and memberships',
  'PUT /me/password': 'the caller\u2019s own account',
  'GET /invitations/by-token/:token': 'the token is the invitee\u2019s capability; it names only the inviting firm',
  'POST /invitations/by-token/:token/accept': 'the token is the invitee\u2019s capability',
  'GET /unsubscribe/:token': 'the token is the recipient\u2019s capability; it names only the sending firm',
  'POST /unsubscribe/:token': 'the token is the recipient\u2019s capability to stop one firm\u2019s marketing',
  'GET /outbox': 'the local mail catcher (development and tests only; not mounted in production)',
  'GET /outbox/:id': 'the local mail catcher (development and tests only; not mounted in production)',
  'POST /payments/webhook': 'signed by the payment service; the event names its account, which names the firm',
  'GET /pay/:token': 'the token is the customer\u2019s capability for one invoice',
  'POST /pay/:token/checkout': 'the token is the customer\u2019s capability for one invoice',
};

/** Tables that are not a firm's: people (who may belong to several firms) and plumbing. */
const nonTenantTables = [
  'firms',
  'users',
  'password_resets',
  'sign_up_requests',
  'sessions',
  'knex_migrations',
  'knex_migrations_lock',
];

let t: TestApp;
let a: SeededFirm;
let b: SeededFirm;
beforeAll(async () => {
  t = createTestApp();
  [a, b] = await Promise.all([seedFirm(t.deps.db, 'iso-a'), seedFirm(t.deps.db, 'iso-b')]);
});
afterAll(() => t.close());

describe('tenant isolation', () => {
  it('every table except people and plumbing carries firm_id', async () => {
    const tables = await allTables(t.deps.db);
    const withFirm = await tenantTables(t.deps.db);
    const missing = tables.filter((x) => !nonTenantTables.includes(x) && !withFirm.includes(x));
    expect(missing).toEqual([]);
  });

  it('every route is either tenant data or listed here with a reason', () => {
    for (const route of apiRoutes) {
      if (route.tenantData) expect(notTenantData[routeKey(route)], `${routeKey(route)} is tenant data`).toBeUndefined();
      else
        expect(
          notTenantData[routeKey(route)],
          `${routeKey(route)} says it is not tenant data: list it with a reason`,
        ).toBeTruthy();
    }
  });

  for (const role of ['owner', 'admin'] as const) {
    it(`a ${role} of firm B gets 404 or only B's data from every tenant route called with firm A's ids, and A is unchanged`, async () => {
      const before = await snapshotFirm(t.deps.db, a.firmId);
      const routes = apiRoutes.filter((r) => r.tenantData);
      expect(routes.length).toBeGreaterThan(0);
      for (const route of routes) {
        const client = await signIn(t.app, b.people[role].email);
        const res = await callProbe(client, route, a);
        const label = `${routeKey(route)} -> ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`;
        expect(res.status === 404 || (res.status >= 200 && res.status < 300), label).toBe(true);
        const text = JSON.stringify(res.body ?? '');
        for (const s of a.sentinels) expect(text.includes(s), `${label} leaks "${s}"`).toBe(false);
      }
      expect(await snapshotFirm(t.deps.db, a.firmId)).toEqual(before);
      // One sign-in (argon2id) per route across some 160 routes: longer than the 30 s default on a busy machine.
    }, 180_000);
  }

  it('the same calls with firm B\u2019s own ids do reach B\u2019s records (so the 404s above mean something)', async () => {
    const client = await signIn(t.app, b.people.owner.email);
    const members = await client.get('/api/members').expect(200);
    expect(JSON.stringify(members.body)).toContain(b.target.email);
    const patched = await client.patch(`/api/members/${b.target.memberId}`, { role: 'stores' });
    expect(patched.status).toBe(200);
    const withdrawn = await client.delete(`/api/invitations/${b.invitation.id}`);
    expect(withdrawn.status).toBe(204);
  });

  it('the routes Express serves are exactly the registry\u2019s, so none escapes these tests', () => {
    type Layer = { route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: Layer[] } };
    const seen = new Set<string>();
    const walk = (stack: Layer[]) => {
      for (const layer of stack) {
        if (layer.route) {
          for (const method of Object.keys(layer.route.methods)) {
            if (method !== '_all') seen.add(`${method.toUpperCase()} ${layer.route.path}`);
          }
        } else if (layer.handle?.stack) walk(layer.handle.stack);
      }
    };
    walk((t.app as unknown as { router: { stack: Layer[] } }).router.stack);
    const registered = new Set(apiRoutes.map(routeKey));
    // The built client's pages, outside /api and holding no firm's data: the pre-rendered sign-in page (and its
    // scripts-off submit, sent back to it) and every other page's index.html.
    const clientPages = new Set(['GET /sign-in', 'POST /sign-in', 'GET /{*splat}']);
    const unregistered = [...seen].filter((k) => !registered.has(k) && !clientPages.has(k));
    expect(unregistered).toEqual([]);
    expect([...registered].filter((k) => !seen.has(k))).toEqual([]);
  });
});
