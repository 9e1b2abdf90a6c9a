import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { formatUkDateTime } from '@heatfleet/domain';
import { createTestApp, signIn, uniqueEmail, type TestApp } from './support/test-app.ts';
import { seedFirm } from './support/seed-firm.ts';

// Issue 14: people read UK dates in the firm's zone; CSVs keep ISO days and times but in the firm's zone, named in
// the header; the ledger's day filters are the firm's days. British Summer Time (UTC+1) runs from the last Sunday
// of March to the last Sunday of October (Summer Time Order 2002), so 23:30 UTC on 14 July 2026 is 00:30 on
// 15 July in London.

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

const LATE_SUMMER_EVENING = new Date('2026-07-14T23:30:00Z');

describe('dates in the firm\u2019s zone', () => {
  it('files a movement at 23:30 UTC on a BST day under the next day, in the ledger filter and the CSV', async () => {
    const firm = await seedFirm(t.deps.db, 'zone-ledger');
    await t.deps
      .db('stock_movements')
      .where({ firm_id: firm.firmId, id: firm.movementId })
      .update({ created_at: LATE_SUMMER_EVENING });
    const stores = await signIn(t.app, firm.people.stores.email);
    const ids = async (from: string, to: string) =>
      (
        (await stores.get(`/api/stock/movements?from=${from}&to=${to}`).expect(200)).body.movements as {
          id: number;
        }[]
      ).map((m) => m.id);

    expect(await ids('2026-07-15', '2026-07-15')).toEqual([firm.movementId]);
    expect(await ids('2026-07-14', '2026-07-14')).toEqual([]);
    expect(await ids('2026-07-10', '2026-07-14')).toEqual([]);

    const csv = await stores.get('/api/stock/movements.csv?from=2026-07-15&to=2026-07-15').expect(200);
    const header = csv.text.split('\n')[0]!;
    expect(header).toContain('"when (Europe/London)"');
    const rows = parse(csv.text, { columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(1);
    expect(rows[0]!['when (Europe/London)']).toBe('2026-07-15 00:30:00');
  });

  it('a winter instant stays on its UTC day (GMT)', async () => {
    const firm = await seedFirm(t.deps.db, 'zone-winter');
    await t.deps
      .db('stock_movements')
      .where({ firm_id: firm.firmId, id: firm.movementId })
      .update({ created_at: new Date('2026-01-15T23:30:00Z') });
    const stores = await signIn(t.app, firm.people.stores.email);
    const body = (await stores.get('/api/stock/movements?from=2026-01-15&to=2026-01-15').expect(200)).body;
    expect((body.movements as { id: number }[]).map((m) => m.id)).toEqual([firm.movementId]);
  });

  it('an invitation e-mail gives its expiry as a UK date and time in the firm\u2019s zone, not a UTC string', async () => {
    const firm = await seedFirm(t.deps.db, 'zone-invite');
    const owner = await signIn(t.app, firm.people.owner.email);
    const to = uniqueEmail('zone-invitee');
    expect((await owner.post('/api/invitations', { email: to, role: 'engineer' })).status).toBe(201);
    const invitation = await t.deps.db('invitations').where({ firm_id: firm.firmId, email: to }).first();
    const email = await t.deps.db('emails').where({ firm_id: firm.firmId, to_address: to }).first();
    const expected = formatUkDateTime(invitation.expires_at as Date, 'Europe/London');
    expect(expected).toMatch(/^\d{1,2} [A-Z][a-z]{2} \d{4}, \d{2}:\d{2}$/);
    expect(email.text_body).toContain(`expires on ${expected} (UK time)`);
    expect(email.text_body).not.toMatch(/GMT|UTC|T\d{2}:\d{2}/);
  });
});
