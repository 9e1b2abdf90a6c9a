import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, type Client } from './support/test-app.ts';
import { seedFirm, type SeededFirm } from './support/seed-firm.ts';
import {
  connectFirm,
  insertIssuedInvoice,
  invoiceMoney,
  payAsCustomer,
  payToken,
  startPaymentStack,
  type PaymentStack,
} from './support/payment-stack.ts';

// Refunds in full or part by Owners and Admins (issue 15; DEVELOPERS.md, Product rules: Roles); the invoice's
// state follows the money (invoiceStateAfterPayments, DEVELOPERS.md "Money"). The service refuses a refund above
// what is left on the charge, as its API reference says of refunds (from memory).
let stack: PaymentStack;
let firm: SeededFirm;
let owner: Client;
let admin: Client;
let engineer: Client;

beforeAll(async () => {
  stack = await startPaymentStack();
  firm = await seedFirm(stack.t.deps.db, 'refunds');
  owner = await signIn(stack.t.app, firm.people.owner.email);
  admin = await signIn(stack.t.app, firm.people.admin.email);
  engineer = await signIn(stack.t.app, firm.people.engineer.email);
  await connectFirm(stack, {
    client: owner,
    firmId: firm.firmId,
    email: firm.people.owner.email,
    userId: firm.people.owner.userId,
  });
});
afterAll(() => stack.close());

async function paidInvoice(total: number): Promise<{ invoiceId: number; paymentId: number }> {
  const invoiceId = await insertIssuedInvoice(stack.t.deps.db, firm.firmId, total);
  await payAsCustomer(stack, engineer, await payToken(engineer, invoiceId), '4242424242424242');
  const list = await owner.get(`/api/invoices/${invoiceId}/payments`).expect(200);
  return { invoiceId, paymentId: list.body.payments[0].id as number };
}

describe('refunds', () => {
  it('an engineer may show the pay QR but not refund', async () => {
    const { invoiceId, paymentId } = await paidInvoice(6_000);
    const refused = await engineer.post(`/api/payments/${paymentId}/refunds`, { amountPence: 100 });
    expect(refused.status).toBe(403);
    expect(await invoiceMoney(stack.t.deps.db, invoiceId)).toEqual({ status: 'paid', paid: 6_000 });
  });

  it('a part refund makes the invoice part paid; the rest in full makes it owed again', async () => {
    const { invoiceId, paymentId } = await paidInvoice(15_000);
    const part = await admin.agent
      .post(`/api/payments/${paymentId}/refunds`)
      .set('X-CSRF-Token', (await admin.refreshCsrf(), admin.csrfToken))
      .set('Idempotency-Key', 'refund-part-0001')
      .send({ amountPence: 4_000, reason: 'One radiator not done' });
    expect(part.status).toBe(201);
    expect(part.body).toMatchObject({ refundedPence: 4_000, status: 'succeeded' });
    expect(part.body.refunds).toEqual([
      expect.objectContaining({ amountPence: 4_000, reason: 'One radiator not done' }),
    ]);
    expect(await invoiceMoney(stack.t.deps.db, invoiceId)).toEqual({ status: 'part_paid', paid: 11_000 });

    // The same tap sent again (same Idempotency-Key) refunds nothing more.
    const again = await admin.agent
      .post(`/api/payments/${paymentId}/refunds`)
      .set('X-CSRF-Token', admin.csrfToken)
      .set('Idempotency-Key', 'refund-part-0001')
      .send({ amountPence: 4_000, reason: 'One radiator not done' });
    expect(again.status).toBe(201);
    await stack.fake.webhooks.settled();
    expect(await invoiceMoney(stack.t.deps.db, invoiceId)).toEqual({ status: 'part_paid', paid: 11_000 });

    const tooMuch = await owner.post(`/api/payments/${paymentId}/refunds`, { amountPence: 11_001 });
    expect(tooMuch.status).toBe(400);
    expect(tooMuch.body.message).toBe('You can refund at most £110.00 of this payment (you asked for £110.01).');

    const rest = await owner.post(`/api/payments/${paymentId}/refunds`, {});
    expect(rest.status).toBe(201);
    expect(rest.body.refundedPence).toBe(15_000);
    await stack.fake.webhooks.settled();
    expect(await invoiceMoney(stack.t.deps.db, invoiceId)).toEqual({ status: 'issued', paid: 0 });
    const charge = stack.fake.state.events.filter((e) => e.type === 'charge.refunded').at(-1)!.data.object;
    expect(charge).toMatchObject({ amount: 15_000, amount_refunded: 15_000, refunded: true });

    const none = await owner.post(`/api/payments/${paymentId}/refunds`, {});
    expect(none.status).toBe(409);
    expect(none.body.message).toBe('This payment has already been refunded in full.');
  });
});

describe('the payment service down', () => {
  it('a clear 503, nothing written, and the pay link works when it returns', async () => {
    const invoiceId = await insertIssuedInvoice(stack.t.deps.db, firm.firmId, 9_900);
    const token = await payToken(engineer, invoiceId);
    await stack.fake.suspend();
    try {
      const down = await engineer.post(`/api/pay/${token}/checkout`, { from: 'doorstep' });
      expect(down.status).toBe(503);
      expect(down.body.message).toBe(
        'The card payment service cannot be reached just now. Nothing has been charged or changed; please try again in a few minutes.',
      );
      expect(await stack.t.deps.db('payments').where({ invoice_id: invoiceId })).toEqual([]);
      // What is owed still shows, from Heatfleet's own records.
      const page = await engineer.get(`/api/pay/${token}`).expect(200);
      expect(page.body).toMatchObject({ duePence: 9_900, state: 'payable' });
    } finally {
      await stack.fake.resume();
    }
    const { page } = await payAsCustomer(stack, engineer, token, '4242424242424242');
    expect(page.status).toBe(303);
    expect(await invoiceMoney(stack.t.deps.db, invoiceId)).toEqual({ status: 'paid', paid: 9_900 });
    expect((await engineer.get(`/api/pay/${token}`).expect(200)).body.state).toBe('paid');
  });
});
