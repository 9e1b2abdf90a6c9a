import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, createTestApp, type TestApp } from './support/test-app.ts';
import { allReasons, setUpMoneyFirm, type MoneyFirm } from './support/money-setup.ts';
import { tinyPng } from './support/route-probes.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

const lines = [
  { kind: 'visit', description: 'Full clean, 1 radiator', quantity: 1, unitPence: 16_500 },
  { kind: 'extra', description: 'Filter fitted', quantity: 1, unitPence: 4_500 },
];

async function sentQuote(m: MoneyFirm) {
  const made = await m.engineer.post('/api/quotes', { jobId: m.firm.jobId, lines });
  expect(made.status).toBe(201);
  const sent = await m.engineer.post(`/api/quotes/${made.body.id}/send`);
  expect(sent.status).toBe(200);
  const email = await t.deps
    .db('emails')
    .where({ firm_id: m.firm.firmId, purpose: 'quote' })
    .orderBy('id', 'desc')
    .first();
  const token = /\/q\/([A-Za-z0-9_-]+)/.exec(email.text_body)![1]!;
  return { quote: sent.body, token, email };
}

// Consumer Contracts (Information, Cancellation and Additional Charges) Regulations 2013 (SI 2013/3134):
// Schedule 3 (model cancellation information and form), regulation 36 (the express request).
describe('quotes', () => {
  it('the customer accepts on the link with their name, a tick and the express request; it flows into the invoice', async () => {
    const m = await setUpMoneyFirm(t, 'quote-link');
    const { quote, token, email } = await sentQuote(m);
    // The seeded quote is Q-00001 (support/seed-money.ts).
    expect(quote).toMatchObject({
      number: 'Q-00002',
      status: 'sent',
      netPence: 21_000,
      vatPence: 4_200,
      totalPence: 25_200,
    });
    expect(email.attachment_key).toMatch(/quotes\/quote-/);
    expect(token.length).toBeGreaterThanOrEqual(43); // 32 random bytes, base64url
    const customer = new Client(t.app);
    const view = await customer.get(`/api/public/quotes/${token}`);
    expect(view.status).toBe(200);
    expect(view.body.firmName).toBe(m.firm.firmName);
    expect(view.body.cancellation.information.join(' ')).toMatch(/within 14 days without giving any reason/);
    expect(view.body.cancellation.modelForm[0]).toMatch(/Model cancellation form/);
    // Nothing of the firm's ids leaks to the customer's view.
    expect(JSON.stringify(view.body)).not.toMatch(/"(id|jobId|priceItemId)"/);
    const noTick = await customer.post(`/api/public/quotes/${token}/accept`, { name: 'A. Customer', agree: false });
    expect(noTick.status).toBe(422);
    const accepted = await customer.post(`/api/public/quotes/${token}/accept`, {
      name: 'A. Customer',
      agree: true,
      expressRequest: true,
    });
    expect(accepted.status).toBe(200);
    expect(accepted.body.acceptance).toMatchObject({ name: 'A. Customer', expressRequest: true });
    expect((await customer.post(`/api/public/quotes/${token}/decline`, {})).status).toBe(409);
    const row = await t.deps.db('quotes').where({ id: quote.id }).first();
    expect(row).toMatchObject({
      status: 'accepted',
      accepted_via: 'link',
      express_request: 1,
      accepted_name: 'A. Customer',
    });
    // An answered quote never changes.
    expect((await m.owner.put(`/api/quotes/${quote.id}`, { lines })).status).toBe(409);
    // The accepted quote's lines are what the job's invoice charges.
    await m.engineer.post(`/api/jobs/${m.firm.jobId}/complete`, allReasons).then((r) => expect(r.status).toBe(200));
    const [inv] = (await m.owner.get(`/api/invoices?jobId=${m.firm.jobId}`)).body.invoices;
    expect(inv).toMatchObject({ quoteId: quote.id, netPence: 21_000, totalPence: 25_200 });
    const pdf = await customer.get(`/api/public/quotes/${token}/quote.pdf`);
    expect(pdf.status).toBe(200);
  });

  it('a link expires: after the validity date the customer cannot accept, and after the token expiry sees nothing', async () => {
    const m = await setUpMoneyFirm(t, 'quote-expiry');
    const { quote, token } = await sentQuote(m);
    const customer = new Client(t.app);
    const days = (n: number) => n * 86_400_000;
    // Valid for 30 days (the firm's setting): 31 days on, the quote has expired (409), the link still shows it.
    t.clock.advance(days(31));
    try {
      const view = await customer.get(`/api/public/quotes/${token}`);
      expect(view.status).toBe(200);
      expect(view.body.expired).toBe(true);
      const late = await customer.post(`/api/public/quotes/${token}/accept`, { name: 'Late', agree: true });
      expect(late.status).toBe(409);
      expect(late.body.message).toMatch(/expired/);
      // Two more days and the link itself has expired: 404, whatever is asked.
      t.clock.advance(days(2));
      expect((await customer.get(`/api/public/quotes/${token}`)).status).toBe(404);
      expect((await customer.post(`/api/public/quotes/${token}/accept`, { name: 'Late', agree: true })).status).toBe(
        404,
      );
    } finally {
      t.clock.advance(-days(33));
    }
    expect((await t.deps.db('quotes').where({ id: quote.id }).first()).status).toBe('sent');
    // A made-up token opens nothing.
    expect((await customer.get(`/api/public/quotes/${'x'.repeat(43)}`)).status).toBe(404);
  });

  it('the engineer takes acceptance on the phone with a drawn signature; the customer can decline a link instead', async () => {
    const m = await setUpMoneyFirm(t, 'quote-phone');
    const made = await m.engineer.post('/api/quotes', { jobId: m.firm.jobId, lines });
    const phone = await m.engineer.post(`/api/quotes/${made.body.id}/accept`, {
      name: 'B. Customer',
      agree: true,
      expressRequest: false,
      imagePngDataUrl: `data:image/png;base64,${tinyPng.toString('base64')}`,
    });
    expect(phone.status).toBe(200);
    expect(phone.body.acceptance).toMatchObject({ via: 'phone', hasSignature: true, expressRequest: false });
    const notPng = await m.engineer.post(`/api/quotes/${made.body.id}/accept`, {
      name: 'B. Customer',
      agree: true,
      imagePngDataUrl: 'data:image/png;base64,AAAA',
    });
    expect([409, 422]).toContain(notPng.status);
    const { token } = await sentQuote(m);
    const declined = await new Client(t.app).post(`/api/public/quotes/${token}/decline`, { reason: 'Too dear' });
    expect(declined.status).toBe(200);
    expect(declined.body.status).toBe('declined');
  });
});
