import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { formatCsvDateTime } from '@heatfleet/domain';
import { createTestApp, signIn, type Client, type TestApp } from './support/test-app.ts';
import { seedFirm } from './support/seed-firm.ts';

// X-Tapped-At: when the engineer tapped, sent by the phone's write queue (apps/web/src/lib/offline). Sane or
// refused (422): not over a minute ahead of the server's clock, not over 7 days old (apps/api/src/middleware/tapped-at.ts).

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

/** A write as the phone's queue sends it: CSRF token, Idempotency-Key and, when given, X-Tapped-At. */
async function queuedPost(client: Client, url: string, body: unknown, tappedAt?: string, key = randomUUID()) {
  if (!client.csrfToken) await client.refreshCsrf();
  let req = client.agent.post(url).set('X-CSRF-Token', client.csrfToken).set('Idempotency-Key', key);
  if (tappedAt !== undefined) req = req.set('X-Tapped-At', tappedAt);
  return req.send(body as object);
}

const minutesAgo = (minutes: number) => new Date(t.clock.now().getTime() - minutes * 60_000).toISOString();

describe('X-Tapped-At on custody', () => {
  it('a check-out sent later keeps the tap time beside its arrival, once, however often it is replayed', async () => {
    const firm = await seedFirm(t.deps.db, 'tap-out');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const tappedAt = minutesAgo(95);
    const key = randomUUID();
    const first = await queuedPost(
      engineer,
      `/api/kits/${firm.kit.id}/check-out`,
      { toLocationId: firm.van.id },
      tappedAt,
      key,
    );
    expect(first.status).toBe(200);
    const again = await queuedPost(
      engineer,
      `/api/kits/${firm.kit.id}/check-out`,
      { toLocationId: firm.van.id },
      tappedAt,
      key,
    );
    expect(again.status).toBe(200);

    const rows = await t.deps.db('custody_events').where({ firm_id: firm.firmId, kit_id: firm.kit.id });
    expect(rows).toHaveLength(firm.kit.itemIds.length);
    for (const row of rows) {
      expect((row.tapped_at as Date).toISOString()).toBe(tappedAt);
      expect((row.created_at as Date).getTime()).toBeGreaterThan(Date.parse(tappedAt) + 90 * 60_000);
    }
    const detail = await engineer.get(`/api/kits/${firm.kit.id}`).expect(200);
    const events = detail.body.events as { tappedAt: string | null; createdAt: string }[];
    expect(events.map((e) => e.tappedAt)).toEqual(rows.map(() => tappedAt));
  });

  it('without the header the event has no tap time (sent straight from the form, as before)', async () => {
    const firm = await seedFirm(t.deps.db, 'tap-none');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    expect(
      (await queuedPost(engineer, `/api/kits/${firm.kit.id}/check-out`, { toLocationId: firm.van.id })).status,
    ).toBe(200);
    const rows = await t.deps.db('custody_events').where({ firm_id: firm.firmId, kit_id: firm.kit.id });
    expect(rows.every((r) => r.tapped_at === null)).toBe(true);
    const item = await engineer.get(`/api/kit-items/${firm.kit.itemIds[0]}`).expect(200);
    expect(item.body.events[0].tappedAt).toBeNull();
  });

  it('refuses a tap time in the future (beyond a minute of clock drift), older than 7 days, or unreadable, writing nothing', async () => {
    const firm = await seedFirm(t.deps.db, 'tap-bad');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const url = `/api/kits/${firm.kit.id}/check-out`;
    const body = { toLocationId: firm.van.id };
    const eventsBefore = (await t.deps.db('custody_events').where({ firm_id: firm.firmId })).length;
    const cases: [string, RegExp][] = [
      [minutesAgo(-2), /later than now by more than a minute.*date and time on the phone/],
      [minutesAgo(7 * 24 * 60 + 5), /more than 7 days ago/],
      ['yesterday at ten', /not a date and time Heatfleet can read/],
      // No zone: it would be read in the server's zone rather than the phone's.
      ['2026-12-03T10:42:00', /not a date and time Heatfleet can read/],
    ];
    for (const [value, message] of cases) {
      const res = await queuedPost(engineer, url, body, value);
      expect(res.status, value).toBe(422);
      expect(res.body.message).toMatch(message);
      expect(res.body.details).toEqual([expect.objectContaining({ path: 'X-Tapped-At' })]);
    }
    expect(await t.deps.db('custody_events').where({ firm_id: firm.firmId })).toHaveLength(eventsBefore);

    // Half a minute ahead is ordinary drift between a phone's clock and the server's.
    const drift = new Date(t.clock.now().getTime() + 30_000).toISOString();
    expect((await queuedPost(engineer, url, body, drift)).status).toBe(200);
  });

  it('judges "now" by the server clock, so a week-old tap is refused once the week has passed', async () => {
    const firm = await seedFirm(t.deps.db, 'tap-age');
    const tappedAt = minutesAgo(6 * 24 * 60);
    t.clock.advance(2 * 86_400_000);
    try {
      // Signed in after the clock moved, so the session is not past its lifetime.
      const engineer = await signIn(t.app, firm.people.engineer.email);
      const res = await queuedPost(
        engineer,
        `/api/kits/${firm.kit.id}/check-out`,
        { toLocationId: firm.van.id },
        tappedAt,
      );
      expect(res.status).toBe(422);
    } finally {
      t.clock.advance(-2 * 86_400_000);
    }
  });
});

describe('X-Tapped-At on stock used by hand', () => {
  it('stores the tap time on the used rows and shows it in the ledger and its CSV', async () => {
    const firm = await seedFirm(t.deps.db, 'tap-use');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const tappedAt = minutesAgo(40);
    const used = await queuedPost(
      engineer,
      '/api/stock/usages',
      { locationId: firm.van.id, productId: firm.product.id, quantity: 1, reason: 'Cleaning job' },
      tappedAt,
    );
    expect(used.status).toBe(201);
    expect(used.body.movements).toEqual([expect.objectContaining({ kind: 'used', tappedAt })]);

    const rows = await t.deps.db('stock_movements').where({ firm_id: firm.firmId, kind: 'used' });
    expect(rows).toHaveLength(1);
    expect((rows[0].tapped_at as Date).toISOString()).toBe(tappedAt);

    const stores = await signIn(t.app, firm.people.stores.email);
    const ledger = await stores.get(`/api/stock/movements?locationId=${firm.van.id}`).expect(200);
    const shown = ledger.body.movements as { kind: string; tappedAt: string | null }[];
    expect(shown.find((m) => m.kind === 'used')?.tappedAt).toBe(tappedAt);
    expect(shown.filter((m) => m.kind !== 'used').every((m) => m.tappedAt === null)).toBe(true);

    const csv = await stores.get(`/api/stock/movements.csv?locationId=${firm.van.id}`).expect(200);
    const lines = parse(csv.text, { columns: true }) as Record<string, string>[];
    // In the firm's zone, named in the header (issue 14).
    expect(lines.find((l) => l.kind === 'used')?.['tapped (Europe/London)']).toBe(
      formatCsvDateTime(tappedAt, 'Europe/London'),
    );
  });

  it('refuses a stock use tapped in the future and takes nothing off the van', async () => {
    const firm = await seedFirm(t.deps.db, 'tap-use-bad');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const res = await queuedPost(
      engineer,
      '/api/stock/usages',
      { locationId: firm.van.id, productId: firm.product.id, quantity: 1, reason: 'Cleaning job' },
      minutesAgo(-10),
    );
    expect(res.status).toBe(422);
    expect(await t.deps.db('stock_movements').where({ firm_id: firm.firmId, kind: 'used' })).toHaveLength(0);
    const balance = await t.deps
      .db('stock_balances')
      .where({ firm_id: firm.firmId, location_id: firm.van.id })
      .first('quantity');
    expect(balance.quantity).toBe(2);
  });
});
