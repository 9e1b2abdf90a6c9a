import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './support/test-app.ts';
import { allReasons, setUpMoneyFirm } from './support/money-setup.ts';
import { recordInvoicePayment } from '@heatfleet/api/modules/money/invoice-payments.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

describe('money export and overview', () => {
  it('exports invoices, credit notes and payments for a range as formula-safe CSV; payments apply once', async () => {
    const m = await setUpMoneyFirm(t, 'money-export');
    await m.engineer.post(`/api/jobs/${m.firm.jobId}/complete`, allReasons).then((r) => expect(r.status).toBe(200));
    const [inv] = (await m.owner.get(`/api/invoices?jobId=${m.firm.jobId}`)).body.invoices;
    // A payment of £100 applied twice under one reference (a webhook repeated) counts once.
    const pay = () =>
      t.deps.db.transaction((trx) => recordInvoicePayment(trx, m.firm.firmId, inv.id, 10_000, 'pay_ref_1'));
    expect(await pay()).toMatchObject({ applied: true, status: 'part_paid', paidPence: 10_000 });
    expect(await pay()).toMatchObject({ applied: false, paidPence: 10_000 });
    await m.owner.post(`/api/invoices/${inv.id}/credit-notes`, { reason: 'goodwill; =HYPERLINK("x")' });
    const today = new Date().toISOString().slice(0, 10);
    const from = new Date(Date.now() - 3 * 86_400_000).toISOString().slice(0, 10);
    const to = new Date(Date.now() + 3 * 86_400_000).toISOString().slice(0, 10);
    const res = await m.owner.get(`/api/money/export.csv?from=${from}&to=${to}`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    const lines = res.text.trim().split('\n');
    expect(lines[0]).toBe('"Type","Number","Date","Tax point","Customer","Net","VAT","Total","Reference","Status"');
    const invoiceRow = lines.find((l) => l.startsWith('"Invoice","INV-00002"'))!;
    expect(invoiceRow).toContain(',194.99,39,233.99,');
    const creditRow = lines.find((l) => l.startsWith('"Credit note"'))!;
    expect(creditRow).toContain(',-194.99,-39,-233.99,');
    // A formula after a separator a spreadsheet may split on: the cell is neutralised with a leading apostrophe
    // (OWASP "CSV Injection"; lib/csv.ts), so it cannot run as a formula.
    expect(creditRow).toContain(`"'Credits INV-00002: goodwill; =HYPERLINK`);
    const paymentRows = lines.filter((l) => l.startsWith('"Payment"'));
    expect(paymentRows).toHaveLength(1);
    expect(paymentRows[0]).toContain(',100,');
    expect(lines.some((l) => l.includes(`"${today}"`) || l.includes(today))).toBe(true);
    // A range that ends before it starts is refused.
    expect((await m.owner.get(`/api/money/export.csv?from=${to}&to=${from}`)).status).toBe(400);
    expect((await m.engineer.get(`/api/money/export.csv?from=${from}&to=${to}`)).status).toBe(403);
  });

  it('the overview shows money owed, aged, and revenue this month', async () => {
    const m = await setUpMoneyFirm(t, 'money-overview');
    await m.engineer.post(`/api/jobs/${m.firm.jobId}/complete`, allReasons).then((r) => expect(r.status).toBe(200));
    const res = await m.owner.get('/api/money/overview');
    expect(res.status).toBe(200);
    // Owed: the new invoice (£233.99) and the seeded one (£120 less £60 credited), issued 2026-11-10.
    expect(res.body.owedPence).toBe(23_399 + 6_000);
    expect(res.body.revenueByMonth).toHaveLength(12);
    const thisMonth = res.body.revenueByMonth.at(-1);
    expect(thisMonth.netPence).toBeGreaterThanOrEqual(19_499);
    const aged = res.body.aged;
    expect(aged.days_0_30 + aged.days_31_60 + aged.days_over_60).toBe(res.body.owedPence);
  });
});

describe('overdue invoices', () => {
  it('remind the customer at 7 and 21 days past due (the firm settings), once each, through the reminder scan', async () => {
    const m = await setUpMoneyFirm(t, 'money-overdue');
    await m.engineer.post(`/api/jobs/${m.firm.jobId}/complete`, allReasons).then((r) => expect(r.status).toBe(200));
    const [inv] = (await m.owner.get(`/api/invoices?jobId=${m.firm.jobId}`)).body.invoices;
    const customerEmail = inv.customerEmail as string;
    const reminders = () =>
      t.deps
        .db('emails')
        .where({ firm_id: m.firm.firmId, to_address: customerEmail })
        .andWhere('subject', 'like', 'Reminder: invoice%')
        .orderBy('id');
    const dueDaysAgo = (n: number) =>
      t.deps
        .db('invoices')
        .where({ id: inv.id })
        .update({ due_on: new Date(Date.now() - n * 86_400_000).toISOString().slice(0, 10) });
    await dueDaysAgo(6);
    expect((await m.owner.post('/api/reminders/scan')).status).toBeLessThan(300);
    expect(await reminders()).toHaveLength(0);
    await dueDaysAgo(8);
    await m.owner.post('/api/reminders/scan');
    await m.owner.post('/api/reminders/scan');
    const first = await reminders();
    expect(first).toHaveLength(1);
    expect(first[0].subject).toContain('INV-00002');
    expect(first[0].text_body).toMatch(/\/pay\/[A-Za-z0-9_-]{40,}/);
    expect(first[0].text_body).toContain('£233.99 is still owed');
    await dueDaysAgo(22);
    await m.owner.post('/api/reminders/scan');
    await m.owner.post('/api/reminders/scan');
    const both = await reminders();
    expect(both).toHaveLength(2);
    expect(both[1].text_body).toMatch(/second reminder/i);
  });
});
