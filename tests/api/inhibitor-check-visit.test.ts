import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm, type SeededFirm } from './support/seed-firm.ts';

// Inhibitor check visits (DEVELOPERS.md, Product rules): judged against the product's own target range (an
// invented 100 to 300 ppm here); a visit that passes sets the next check 12 calendar months on, one that
// still fails 1 month on (common practice (no source)); a top-up comes off the van through the stock ledger
// (stock never negative); the customer gets a short note with UK dates ("30 December 2026", GOV.UK style).

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

/** An inhibitor with 3 packs on the engineer's van (one batch). */
async function inhibitorOnVan(firm: SeededFirm, packs = 3) {
  const [productId] = (await t.deps.db('products').insert({
    firm_id: firm.firmId,
    name: `Visit inhibitor ${firm.firmId}`,
    kind: 'inhibitor',
    pack_size_ml: 500,
    target_min: 100,
    target_max: 300,
    target_unit: 'ppm',
  })) as [number];
  const [batchId] = (await t.deps.db('product_batches').insert({
    firm_id: firm.firmId,
    product_id: productId,
    lot_number: `INH${firm.firmId}`,
    expires_on: '2030-06-30',
  })) as [number];
  await t.deps.db('stock_balances').insert({
    firm_id: firm.firmId,
    location_id: firm.van.id,
    batch_id: batchId,
    product_id: productId,
    quantity: packs,
  });
  return { productId, batchId };
}

const onVan = async (firm: SeededFirm, batchId: number) =>
  (
    await t.deps
      .db('stock_balances')
      .where({ firm_id: firm.firmId, location_id: firm.van.id, batch_id: batchId })
      .first()
  ).quantity as number;
const nextCheck = async (firm: SeededFirm) =>
  (await t.deps.db('sites').where({ id: firm.siteId }).first('next_check_on')).next_check_on as string | null;
const notes = (firm: SeededFirm) =>
  t.deps
    .db('emails')
    .where({ firm_id: firm.firmId, purpose: 'site-check' })
    .select('to_address', 'subject', 'text_body');

describe('inhibitor check visits', () => {
  it('a failed check with no top-up brings the next check to a month on, and tells the customer so', async () => {
    const firm = await seedFirm(t.deps.db, 'visit-fail');
    const { productId } = await inhibitorOnVan(firm);
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const res = await engineer.post(`/api/sites/${firm.siteId}/checks`, {
      checkedOn: '2026-11-30',
      inhibitorProductId: productId,
      inhibitorReading: 60,
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.check).toMatchObject({
      result: 'fail',
      firstResult: 'fail',
      retestReading: null,
      topUp: null,
      nextCheckOn: '2026-12-30',
      noteEmailed: true,
    });
    expect(await nextCheck(firm)).toBe('2026-12-30');
    const [note] = await notes(firm);
    expect(note.to_address).toMatch(/@customer\.example$/);
    expect(note.subject).toContain('needs a follow-up');
    expect(note.text_body).toContain('on 30 November 2026');
    expect(note.text_body).toContain(
      `Visit inhibitor ${firm.firmId}: 60 ppm, below the target range (100 to 300 ppm).`,
    );
    expect(note.text_body).toContain('We will check it again by 30 December 2026.');
    expect(note.text_body).not.toMatch(/\d{4}-\d{2}-\d{2}/);
  });

  it('topped up from the van and re-tested in range, the visit passes: a year on, the packs off the van', async () => {
    const firm = await seedFirm(t.deps.db, 'visit-topup');
    const { productId, batchId } = await inhibitorOnVan(firm);
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const res = await engineer.post(`/api/sites/${firm.siteId}/checks`, {
      checkedOn: '2026-11-30',
      inhibitorProductId: productId,
      inhibitorReading: 60,
      topUp: { vanId: firm.van.id, packs: 2 },
      retestReading: 180,
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.check).toMatchObject({
      result: 'pass',
      firstResult: 'fail',
      inhibitorReading: 60,
      retestReading: 180,
      topUp: { packs: 2, van: { id: firm.van.id } },
      nextCheckOn: '2027-11-30',
    });
    expect(res.body.site.nextCheckOn).toBe('2027-11-30');
    expect(await onVan(firm, batchId)).toBe(1);
    const used = await t.deps
      .db('stock_movements')
      .where({ firm_id: firm.firmId, kind: 'used', batch_id: batchId })
      .select('quantity_delta', 'location_id', 'reason');
    expect(used).toEqual([
      { quantity_delta: -2, location_id: firm.van.id, reason: expect.stringContaining('Inhibitor top-up') },
    ]);
    const [note] = await notes(firm);
    expect(note.text_body).toContain(
      'We topped up the inhibitor (2 packs) and tested again: 180 ppm, within the target range.',
    );
    expect(note.text_body).toContain('The next check is due by 30 November 2027.');
  });

  it('refuses a top-up larger than the van holds, or from a van that is not theirs, changing nothing', async () => {
    const firm = await seedFirm(t.deps.db, 'visit-short');
    const { productId, batchId } = await inhibitorOnVan(firm, 1);
    await t.deps.db('sites').where({ id: firm.siteId }).update({ next_check_on: '2027-01-15' });
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const visit = { checkedOn: '2026-11-30', inhibitorProductId: productId, inhibitorReading: 60, retestReading: 150 };
    const short = await engineer.post(`/api/sites/${firm.siteId}/checks`, {
      ...visit,
      topUp: { vanId: firm.van.id, packs: 2 },
    });
    expect(short.status).toBe(409);
    expect(short.body.message).toBe(
      `Only 1 usable pack of Visit inhibitor ${firm.firmId} at visit-short van; 2 asked for. Nothing was used.`,
    );
    const notTheirs = await engineer.post(`/api/sites/${firm.siteId}/checks`, {
      ...visit,
      topUp: { vanId: firm.spareVanId, packs: 1 },
    });
    expect(notTheirs.status).toBe(403);
    expect(await onVan(firm, batchId)).toBe(1);
    expect(await t.deps.db('site_checks').where({ firm_id: firm.firmId })).toEqual([]);
    expect(await notes(firm)).toEqual([]);
    expect(await nextCheck(firm)).toBe('2027-01-15');
  });

  it('a retry with the same Idempotency-Key records one visit and takes the packs once', async () => {
    const firm = await seedFirm(t.deps.db, 'visit-retry');
    const { productId, batchId } = await inhibitorOnVan(firm);
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const body = {
      checkedOn: '2026-11-30',
      inhibitorProductId: productId,
      inhibitorReading: 80,
      topUp: { vanId: firm.van.id, packs: 1 },
      retestReading: 150,
    };
    const key = `visit-${firm.firmId}-retry-key`;
    await engineer.refreshCsrf();
    const first = await engineer.agent
      .post(`/api/sites/${firm.siteId}/checks`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .set('Idempotency-Key', key)
      .send(body);
    const again = await engineer.agent
      .post(`/api/sites/${firm.siteId}/checks`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .set('Idempotency-Key', key)
      .send(body);
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    expect(again.status).toBe(201);
    expect(again.body.check.id).toBe(first.body.check.id);
    expect(await t.deps.db('site_checks').where({ firm_id: firm.firmId })).toHaveLength(1);
    expect(await onVan(firm, batchId)).toBe(2);
    expect(await notes(firm)).toHaveLength(1);
  });

  it('no note when the customer has no e-mail address or the engineer says not to send one', async () => {
    const firm = await seedFirm(t.deps.db, 'visit-quiet');
    const { productId } = await inhibitorOnVan(firm);
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const quiet = await engineer.post(`/api/sites/${firm.siteId}/checks`, {
      checkedOn: '2026-11-30',
      inhibitorProductId: productId,
      inhibitorReading: 150,
      emailCustomer: false,
    });
    expect(quiet.status, JSON.stringify(quiet.body)).toBe(201);
    expect(quiet.body.check.noteEmailed).toBe(false);
    await t.deps.db('customers').where({ id: firm.customerId }).update({ email: null });
    const none = await engineer.post(`/api/sites/${firm.siteId}/checks`, {
      checkedOn: '2026-11-30',
      inhibitorProductId: productId,
      inhibitorReading: 150,
    });
    expect(none.status).toBe(201);
    expect(none.body.check.noteEmailed).toBe(false);
    expect(await notes(firm)).toEqual([]);
  });
});
