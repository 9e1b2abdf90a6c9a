import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './support/test-app.ts';
import { allReasons, setUpMoneyFirm } from './support/money-setup.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

// Regulation 14(1)(a) of the Value Added Tax Regulations 1995: "a sequential number based on one or more
// series which uniquely identifies the document". Gap-free by a counter row per firm taken in the completion's
// transaction (migrations/20261203050100_create-money-sequences.ts).
describe('the invoice sequence', () => {
  it('20 concurrent completions give 20 consecutive numbers, no gap and no repeat', async () => {
    const m = await setUpMoneyFirm(t, 'inv-seq');
    const { db } = t.deps;
    const job = await db('jobs').where({ id: m.firm.jobId }).first();
    // 20 more jobs like the seeded one, and enough packs on the van for all 21.
    const ids: number[] = [m.firm.jobId];
    for (let i = 0; i < 19; i++) {
      const [id] = (await db('jobs').insert({
        firm_id: m.firm.firmId,
        site_id: job.site_id,
        engineer_member_id: job.engineer_member_id,
        van_location_id: job.van_location_id,
        scheduled_on: job.scheduled_on,
        survey: job.survey,
      })) as number[];
      await db('job_products').insert({ firm_id: m.firm.firmId, job_id: id, product_id: m.firm.product.id });
      ids.push(id!);
    }
    await db('stock_balances')
      .where({ firm_id: m.firm.firmId, location_id: m.firm.van.id, batch_id: m.firm.product.batchId })
      .update({ quantity: 40 });
    // All 20 completions at once (the engineer's session; each request its own transaction). The API's pool
    // (10 connections, 4 s to get one) answers some of them 503 while the others queue on the locks; a phone
    // sends a 503 again (DEVELOPERS.md, the queue's rules), so the test does too until every job is done.
    await m.engineer.refreshCsrf();
    let pending = [...ids];
    let attempts = 0;
    let busy = 0;
    while (pending.length && attempts < 10) {
      attempts += 1;
      const results = await Promise.all(pending.map((id) => m.engineer.post(`/api/jobs/${id}/complete`, allReasons)));
      for (const r of results) expect([200, 503]).toContain(r.status);
      busy += results.filter((r) => r.status === 503).length;
      pending = pending.filter((_, i) => results[i]!.status !== 200);
    }
    expect(pending).toEqual([]);
    console.info(`20 concurrent completions: ${attempts} round(s), ${busy} answered 503 and sent again`);
    const invoices = await db('invoices').where({ firm_id: m.firm.firmId }).whereIn('job_id', ids).select('number');
    const numbers = invoices.map((r: { number: number }) => r.number).sort((a: number, b: number) => a - b);
    // The seeded invoice is number 1 (support/seed-money.ts): these are 2..21.
    expect(numbers).toEqual(Array.from({ length: 20 }, (_, i) => i + 2));
    const counter = await db('money_sequences').where({ firm_id: m.firm.firmId, kind: 'invoice' }).first();
    expect(counter.last_number).toBe(21);
  }, 120_000);

  it('a completion that fails takes no number (its transaction gives the number back)', async () => {
    const m = await setUpMoneyFirm(t, 'inv-seq-fail');
    // The van is emptied: the completion is refused (409), and nothing is invoiced.
    await t.deps
      .db('stock_balances')
      .where({ firm_id: m.firm.firmId, location_id: m.firm.van.id })
      .update({ quantity: 0 });
    const refused = await m.engineer.post(`/api/jobs/${m.firm.jobId}/complete`, allReasons);
    expect(refused.status).toBe(409);
    const counter = await t.deps.db('money_sequences').where({ firm_id: m.firm.firmId, kind: 'invoice' }).first();
    expect(counter.last_number).toBe(1);
    // The next invoice, made by hand, is number 2.
    await t.deps
      .db('stock_balances')
      .where({ firm_id: m.firm.firmId, location_id: m.firm.van.id })
      .update({ quantity: 2 });
    await m.engineer.post(`/api/jobs/${m.firm.jobId}/complete`, allReasons).then((r) => expect(r.status).toBe(200));
    const [inv] = (await m.owner.get(`/api/invoices?jobId=${m.firm.jobId}`)).body.invoices;
    expect(inv.number).toBe('INV-00002');
  });
});
