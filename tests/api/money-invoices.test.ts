import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './support/test-app.ts';
import { allReasons, setUpMoneyFirm, VAT_NUMBER } from './support/money-setup.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

// What a VAT invoice must show: Value Added Tax Regulations 1995 (SI 1995/2518), regulation 14(1).
// VAT per line, nearest penny, half up: HMRC VAT Notice 700 paragraph 17.5 (vat-lines.ts).

describe('invoices', () => {
  it('completion issues a VAT invoice with the regulation 14 particulars, e-mailed with a pay link', async () => {
    const m = await setUpMoneyFirm(t, 'inv-complete');
    const done = await m.engineer.post(`/api/jobs/${m.firm.jobId}/complete`, allReasons);
    expect(done.status).toBe(200);
    const list = await m.owner.get(`/api/invoices?jobId=${m.firm.jobId}`);
    expect(list.status).toBe(200);
    expect(list.body.invoices).toHaveLength(1);
    const inv = (await m.owner.get(`/api/invoices/${list.body.invoices[0].id}`)).body;
    expect(inv.status).toBe('issued');
    expect(inv.number).toBe('INV-00002');
    expect(inv.vatNumber).toBe(VAT_NUMBER);
    expect(inv.firmName).toBe(m.firm.firmName);
    expect(inv.customerName).toContain('inv-complete customer');
    expect(inv.customerAddress).toContain('Quarry Lane');
    expect(inv.suppliedAt).toBe(done.body.job.completedAt);
    // 1 radiator: £150 + £15 = £165.00, VAT £33.00; one pack of cleaner used: £29.99, VAT £5.998 -> £6.00.
    expect(
      inv.lines.map((l: Record<string, unknown>) => [
        l.description,
        l.quantity,
        l.unitPence,
        l.vatRateBp,
        l.netPence,
        l.vatPence,
      ]),
    ).toEqual([
      ['Full clean, 1 radiator', 1, 16_500, 2000, 16_500, 3_300],
      ['Cleaner, 1 L', 1, 2_999, 2000, 2_999, 600],
    ]);
    expect([inv.netPence, inv.vatPence, inv.totalPence]).toEqual([19_499, 3_900, 23_399]);
    expect(inv.duePence).toBe(23_399);
    const email = await t.deps.db('emails').where({ firm_id: m.firm.firmId, purpose: 'invoice' }).first();
    expect(email.subject).toContain('INV-00002');
    expect(email.text_body).toMatch(/\/pay\/[A-Za-z0-9_-]{40,}/);
    expect(email.attachment_key).toMatch(/invoices\/invoice-/);
    const pdf = await m.owner.get(`/api/invoices/${inv.id}/invoice.pdf`);
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
  });

  it('an issued invoice never changes (409) and a credit note corrects it with its own number', async () => {
    const m = await setUpMoneyFirm(t, 'inv-immutable');
    await m.engineer.post(`/api/jobs/${m.firm.jobId}/complete`, allReasons).then((r) => expect(r.status).toBe(200));
    const [summary] = (await m.owner.get(`/api/invoices?jobId=${m.firm.jobId}`)).body.invoices;
    const before = await t.deps.db('invoice_lines').where({ invoice_id: summary.id }).orderBy('id');
    const edit = await m.owner.put(`/api/invoices/${summary.id}/lines`, {
      lines: [{ kind: 'other', description: 'Cheaper', quantity: 1, unitPence: 1 }],
    });
    expect(edit.status).toBe(409);
    expect(edit.body.message).toMatch(/credit note/);
    expect(await t.deps.db('invoice_lines').where({ invoice_id: summary.id }).orderBy('id')).toEqual(before);
    expect((await m.owner.post(`/api/invoices/${summary.id}/issue`)).status).toBe(409);
    const inv = (await m.owner.get(`/api/invoices/${summary.id}`)).body;
    // Credit the cleaner only: £29.99 + £6.00 = £35.99.
    const cleaner = inv.lines.find((l: { kind: string }) => l.kind === 'chemical');
    const credit = await m.owner.post(`/api/invoices/${inv.id}/credit-notes`, {
      reason: 'Cleaner not needed',
      lines: [{ invoiceLineId: cleaner.id, quantity: 1 }],
    });
    expect(credit.status).toBe(201);
    expect(credit.body.creditNotes).toHaveLength(1); // the seeded CN-00001 is on another invoice
    expect(credit.body.creditNotes[0]).toMatchObject({
      number: 'CN-00002',
      netPence: 2_999,
      vatPence: 600,
      totalPence: 3_599,
    });
    expect(credit.body.creditedPence).toBe(3_599);
    expect(credit.body.duePence).toBe(23_399 - 3_599);
    expect(credit.body.status).toBe('issued');
    // The invoice's own lines and totals are as issued.
    expect(credit.body.totalPence).toBe(23_399);
    // The cleaner cannot be credited twice.
    const twice = await m.owner.post(`/api/invoices/${inv.id}/credit-notes`, {
      reason: 'Again',
      lines: [{ invoiceLineId: cleaner.id, quantity: 1 }],
    });
    expect(twice.status).toBe(400);
    // The rest credited: the invoice is credited, nothing due.
    const rest = await m.owner.post(`/api/invoices/${inv.id}/credit-notes`, { reason: 'Job written off' });
    expect(rest.status).toBe(201);
    expect(rest.body.creditNotes.map((n: { number: string }) => n.number)).toEqual(['CN-00002', 'CN-00003']);
    expect(rest.body.status).toBe('credited');
    expect(rest.body.duePence).toBe(0);
    const pdf = await m.owner.get(`/api/credit-notes/${rest.body.creditNotes[1].id}/credit-note.pdf`);
    expect(pdf.status).toBe(200);
  });

  it('a firm not registered for VAT charges no VAT and prints no VAT number', async () => {
    const m = await setUpMoneyFirm(t, 'inv-novat', { vatRegistered: false });
    await m.engineer.post(`/api/jobs/${m.firm.jobId}/complete`, allReasons).then((r) => expect(r.status).toBe(200));
    const [summary] = (await m.owner.get(`/api/invoices?jobId=${m.firm.jobId}`)).body.invoices;
    const inv = (await m.owner.get(`/api/invoices/${summary.id}`)).body;
    expect(inv.vatRegistered).toBe(false);
    expect(inv.vatNumber).toBeNull();
    expect(inv.lines.every((l: { vatPence: number; vatRateBp: number }) => l.vatPence === 0 && l.vatRateBp === 0)).toBe(
      true,
    );
    expect([inv.netPence, inv.vatPence, inv.totalPence]).toEqual([19_499, 0, 19_499]);
    const pdf = await m.owner.get(`/api/invoices/${inv.id}/invoice.pdf`).buffer(true);
    expect(pdf.status).toBe(200);
  });

  it('an invoice made by hand is a draft until issued, and may be edited until then; engineers may not', async () => {
    const m = await setUpMoneyFirm(t, 'inv-hand');
    expect((await m.engineer.post('/api/invoices', { jobId: m.firm.jobId })).status).toBe(403);
    const draft = await m.owner.post('/api/invoices', { jobId: m.firm.jobId });
    expect(draft.status).toBe(201);
    expect(draft.body).toMatchObject({ status: 'draft', number: null });
    const edit = await m.owner.put(`/api/invoices/${draft.body.id}/lines`, {
      lines: [
        { kind: 'extra', description: 'Filter fitted', quantity: 1, unitPence: 4_500 },
        { kind: 'other', description: 'Radiator valve', quantity: 2, unitPence: 1_237 },
      ],
    });
    expect(edit.status).toBe(200);
    // 2 x £12.37 = £24.74; 20% = £4.948 -> £4.95. Filter £45 -> £9.00.
    expect(edit.body.lines.map((l: { vatPence: number }) => l.vatPence)).toEqual([900, 495]);
    expect(edit.body.totalPence).toBe(4_500 + 2_474 + 900 + 495);
    expect((await m.owner.post('/api/invoices', { jobId: m.firm.jobId })).status).toBe(409);
    const issued = await m.owner.post(`/api/invoices/${draft.body.id}/issue`);
    expect(issued.status).toBe(200);
    expect(issued.body).toMatchObject({ status: 'issued', number: 'INV-00002' });
    // A later completion does not invoice the job again.
    await m.engineer.post(`/api/jobs/${m.firm.jobId}/complete`, allReasons).then((r) => expect(r.status).toBe(200));
    expect((await m.owner.get(`/api/invoices?jobId=${m.firm.jobId}`)).body.invoices).toHaveLength(1);
  });
});
