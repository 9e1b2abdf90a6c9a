import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { roles, type Role } from '@heatfleet/domain';
import { apiRoutes } from '@heatfleet/api/routes/api-routes.ts';
import { Client, createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm } from './support/seed-firm.ts';
import { callProbe, routeKey } from './support/route-probes.ts';

const everyone: Role[] = [...roles];
const managers: Role[] = ['owner', 'admin'];
const fleetManagers: Role[] = ['owner', 'admin', 'stores'];

/**
 * Who may call each member route, written out by hand from the role table in DEVELOPERS.md, Product rules (not derived
 * from the rules under test). A route missing here fails the test.
 */
const allowed: Record<string, Role[]> = {
  'GET /me': everyone,
  'PUT /me/active-firm': everyone,
  'POST /me/firms': everyone,
  'PUT /me/password': everyone,
  'GET /members': everyone,
  'PATCH /members/:id': managers,
  'GET /invitations': managers,
  'POST /invitations': managers,
  'DELETE /invitations/:id': managers,
  'GET /vans': everyone,
  'POST /vans': fleetManagers,
  'GET /vans/:id': everyone,
  'PATCH /vans/:id': fleetManagers,
  'GET /depots': everyone,
  'POST /depots': fleetManagers,
  'GET /me/van': everyone,
  'GET /item-kinds': everyone,
  'POST /item-kinds': fleetManagers,
  'PATCH /item-kinds/:id': fleetManagers,
  'GET /kits': everyone,
  'POST /kits': fleetManagers,
  'GET /kits/:id': everyone,
  'PATCH /kits/:id': fleetManagers,
  // The probe checks the kit out to the firm's van, whose engineer is the seeded engineer: their own van.
  'POST /kits/:id/check-out': everyone,
  // The probe's kit is at the depot, so check-in and move answer 409 (nothing to move) for anyone
  // allowed to try; who may move what between whose vans is tested in fleet.test.ts.
  'POST /kits/:id/check-in': everyone,
  'POST /kits/:id/move': everyone,
  'GET /kit-items/labels': everyone,
  'GET /kit-items': everyone,
  'POST /kit-items': fleetManagers,
  'GET /kit-items/:id': everyone,
  'PATCH /kit-items/:id': fleetManagers,
  'POST /kit-items/:id/check-out': everyone,
  'POST /kit-items/:id/check-in': everyone,
  'POST /kit-items/:id/move': everyone,
  'POST /kit-items/:id/inspections': everyone,
  'POST /photos': everyone,
  'GET /photos/:id/content': everyone,
  'GET /products': everyone,
  'POST /products': fleetManagers,
  'GET /products/:id': everyone,
  'PUT /products/:id': fleetManagers,
  'POST /products/:id/safety-data-sheet': fleetManagers,
  'GET /products/:id/safety-data-sheet': everyone,
  'GET /stock': everyone,
  'GET /stock/batches': everyone,
  'GET /stock/movements': everyone,
  'GET /stock/movements.csv': everyone,
  'POST /stock/receipts': fleetManagers,
  'POST /stock/transfers': fleetManagers,
  // The probe uses stock from the firm's van, whose engineer is the seeded engineer: their own van.
  'POST /stock/usages': everyone,
  'POST /stock/stocktakes': fleetManagers,
  'POST /stock/write-offs': fleetManagers,
  'POST /stock/movements/:id/reverse': fleetManagers,
  'GET /par-levels': everyone,
  'PUT /par-levels': fleetManagers,
  'GET /stock/restock-run': everyone,
  'POST /stock/restock-run': fleetManagers,
  'GET /stock/reorder-list.csv': everyone,
  'GET /stock/booked-jobs-short': everyone,
  'GET /me/van/stock': everyone,
  'GET /customers': everyone,
  'POST /customers': everyone,
  'GET /customers/:id': everyone,
  'POST /customers/:id/sites': everyone,
  'GET /jobs': everyone,
  'POST /jobs': everyone,
  'GET /jobs/:id': everyone,
  // The probe's job is the seeded engineer's own: they may complete it; so may the office.
  'POST /jobs/:id/complete': everyone,
  'GET /jobs/:id/report.pdf': everyone,
  'GET /jobs/:id/customer-report.pdf': everyone,
  // The job sheet's writes: the probe's job is the seeded engineer's own, so every role may write it.
  'PUT /jobs/:id/steps/:step': everyone,
  'PUT /jobs/:id/radiators/:index/readings/:phase': everyone,
  'PUT /jobs/:id/radiators/:index/agitation': everyone,
  'PUT /jobs/:id/radiators/:index/flushed': everyone,
  'PUT /jobs/:id/water-tests': everyone,
  'PUT /jobs/:id/kit': everyone,
  'PUT /jobs/:id/notes': everyone,
  'POST /jobs/:id/photos': everyone,
  // Editing, cancelling, the flush order and signatures: the probe's job is the seeded engineer's own.
  'PATCH /jobs/:id': everyone,
  'POST /jobs/:id/cancel': everyone,
  'PUT /jobs/:id/flush-order': everyone,
  'POST /jobs/:id/signatures': everyone,
  'GET /jobs/:id/signatures/:kind': everyone,
  'GET /reminders': ['owner', 'admin', 'stores'],
  'POST /reminders/scan': managers,
  'GET /reminder-settings': managers,
  'PUT /reminder-settings': managers,
  'GET /marketing-suppressions': managers,
  'POST /marketing-suppressions': managers,
  'GET /firm': everyone,
  'PUT /firm': managers,
  'GET /overview': everyone,
  'GET /sites': everyone,
  'GET /sites/:id': everyone,
  // The probe's product is a cleaner, so anyone allowed gets 422 (not an inhibitor); sites.test.ts records real checks.
  'POST /sites/:id/checks': everyone,
  // Money: everyone sees prices, quotes and invoices; engineers make, send and take acceptance of quotes;
  // prices, invoices, credit notes, the export and the money overview are the Owner's and Admin's.
  'GET /money/prices': everyone,
  'PUT /money/settings': managers,
  'POST /money/price-items': managers,
  'PUT /price-items/:id': managers,
  'GET /jobs/:id/price-lines': everyone,
  'GET /money/export.csv': managers,
  'GET /money/overview': managers,
  'GET /invoices': everyone,
  'POST /invoices': managers,
  'GET /invoices/:id': everyone,
  'PUT /invoices/:id/lines': managers,
  'POST /invoices/:id/issue': managers,
  'POST /invoices/:id/credit-notes': managers,
  'GET /invoices/:id/invoice.pdf': everyone,
  'GET /credit-notes/:id/credit-note.pdf': everyone,
  'GET /quotes': everyone,
  'POST /quotes': ['owner', 'admin', 'engineer'],
  'GET /quotes/:id': everyone,
  'PUT /quotes/:id': ['owner', 'admin', 'engineer'],
  'POST /quotes/:id/send': ['owner', 'admin', 'engineer'],
  'POST /quotes/:id/accept': ['owner', 'admin', 'engineer'],
  'GET /quotes/:id/quote.pdf': everyone,
  // Payments: anyone may show the pay QR and see an invoice's payments; Owners and Admins refund, connect the
  // payment account and keep the firm's own subscription (firm settings: DEVELOPERS.md, Product rules; issue 15).
  // The probe's firm has no payment account, so the QR answers 409 and its pending payment cannot be refunded (409).
  'GET /payments/account': managers,
  'POST /payments/account/onboarding': managers,
  'GET /invoices/:id/payments': everyone,
  'POST /invoices/:id/pay-link': everyone,
  'POST /payments/:id/refunds': managers,
  'GET /billing': managers,
  'GET /billing/status': everyone,
  'POST /billing/card': managers,
  'POST /billing/pay': managers,
  // Health surveillance is arranged by those who run the firm (Control of Vibration at Work Regulations 2005, reg. 7).
  'GET /vibration/register': managers,
};

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

describe('role matrix', () => {
  const memberRoutes = apiRoutes.filter((r) => r.access === 'member');

  it('lists every member route', () => {
    expect(memberRoutes.map(routeKey).filter((k) => !allowed[k])).toEqual([]);
  });

  for (const role of roles) {
    it(`a ${role} is allowed exactly the routes the role table gives, in their own firm`, async () => {
      const outcomes: string[] = [];
      for (const route of memberRoutes) {
        // A fresh firm per call, so one call's change (a withdrawn invitation) cannot decide the next.
        const firm = await seedFirm(t.deps.db, `matrix-${role}`);
        const client = await signIn(t.app, firm.people[role].email);
        const res = await callProbe(client, route, firm);
        const expectAllowed = allowed[routeKey(route)]!.includes(role);
        const ok = expectAllowed ? res.status !== 403 && res.status !== 401 && res.status < 500 : res.status === 403;
        if (!ok)
          outcomes.push(
            `${routeKey(route)}: expected ${expectAllowed ? 'allowed' : '403'}, got ${res.status} ${res.body?.message ?? ''}`,
          );
      }
      expect(outcomes).toEqual([]);
      // A fresh firm per route makes this grow with the route list (over 100 routes: about 30 s a role on 2 cores).
    }, 120_000);
  }

  it('signed out, every member route answers 401 with the error body', async () => {
    const firm = await seedFirm(t.deps.db, 'matrix-anon');
    for (const route of memberRoutes) {
      const client = new Client(t.app);
      const res = await callProbe(client, route, firm);
      expect(res.status, routeKey(route)).toBe(401);
      expect(res.body.error).toBe('SignedOut');
    }
  });
});
