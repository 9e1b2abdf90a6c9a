import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signatureHeader } from '@heatfleet/payfake';
import { signUpFirm, type SignedUp } from './support/test-app.ts';
import {
  connectFirm,
  insertIssuedInvoice,
  invoiceMoney,
  payAsCustomer,
  payToken,
  startPaymentStack,
  TEST_WEBHOOK_SECRET,
  type PaymentStack,
} from './support/payment-stack.ts';

// The webhook contract is the payment service's published one (its "Check the webhook signatures" guide, from
// memory): Stripe-Signature "t=<unix>,v1=<HMAC-SHA256(secret, t + '.' + body)>", events delivered at least once,
// in no guaranteed order, and retried on any non-2xx answer.
let stack: PaymentStack;
let owner: SignedUp;
let accountId: string;

beforeAll(async () => {
  stack = await startPaymentStack();
  owner = await signUpFirm(stack.t.app, 'pay-hooks');
  accountId = await connectFirm(stack, owner);
});
afterAll(() => stack.close());

async function rowsAbout(invoiceId: number) {
  const db = stack.t.deps.db;
  return {
    invoice: await invoiceMoney(db, invoiceId),
    payments: await db('payments').where({ invoice_id: invoiceId }).select('status', 'amount_pence', 'refunded_pence'),
    receipts: await db('invoice_receipts').where({ invoice_id: invoiceId }).select('payment_ref', 'amount_pence'),
    events: Number(
      ((await db('payment_events').where({ firm_id: owner.firmId }).count({ n: '*' })) as { n: number }[])[0]!.n,
    ),
  };
}

describe('payment webhooks', () => {
  it('connecting the account arrives as account.updated and shows the account taking cards', async () => {
    expect(accountId).toMatch(/^acct_/);
    const res = await owner.client.get('/api/payments/account').expect(200);
    expect(res.body).toEqual({ connected: true, chargesEnabled: true, detailsSubmitted: true });
  });

  it('a customer pays on the hosted page: the invoice is paid, and the event replayed five times applies once', async () => {
    const invoiceId = await insertIssuedInvoice(stack.t.deps.db, owner.firmId, 12_000);
    const token = await payToken(owner.client, invoiceId);
    const { page } = await payAsCustomer(stack, owner.client, token, '4242 4242 4242 4242');
    expect(page.status).toBe(303);
    const paid = await rowsAbout(invoiceId);
    expect(paid.invoice).toEqual({ status: 'paid', paid: 12_000 });
    expect(paid.payments).toEqual([{ status: 'succeeded', amount_pence: 12_000, refunded_pence: 0 }]);
    expect(paid.receipts).toHaveLength(1);

    const succeeded = stack.fake.state.events.filter(
      (e) => e.type === 'payment_intent.succeeded' && e.account === accountId,
    );
    const event = succeeded.at(-1)!;
    for (let i = 0; i < 5; i += 1) stack.fake.webhooks.resend(event);
    await stack.fake.webhooks.settled();
    expect(await rowsAbout(invoiceId)).toEqual(paid);
  });

  it('a tampered body or a wrong secret answers 400 and changes nothing', async () => {
    const invoiceId = await insertIssuedInvoice(stack.t.deps.db, owner.firmId, 5_000);
    const before = await rowsAbout(invoiceId);
    const real = stack.fake.state.events.find((e) => e.type === 'payment_intent.succeeded')!;
    const forged = structuredClone(real);
    forged.id = 'evt_forged_one';
    (forged.data.object as unknown as { metadata: Record<string, string> }).metadata.invoiceId = String(invoiceId);
    const original = JSON.stringify(real);
    const tampered = JSON.stringify(forged);
    const send = (body: string, header: string) =>
      fetch(`${stack.t.deps.env.APP_ORIGIN}/api/payments/webhook`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', 'Stripe-Signature': header },
        body,
      });
    const signedOriginal = signatureHeader(original, TEST_WEBHOOK_SECRET);
    const r1 = await send(tampered, signedOriginal);
    expect(r1.status).toBe(400);
    expect(((await r1.json()) as { message: string }).message).toMatch(/not signed by the payment service/);
    const r2 = await send(tampered, signatureHeader(tampered, 'whsec_someone_else'));
    expect(r2.status).toBe(400);
    const r3 = await send(tampered, 'garbage');
    expect(r3.status).toBe(400);
    // An old signature (over five minutes) is refused too, as the SDK's verifier's default tolerance says.
    const r4 = await send(
      tampered,
      signatureHeader(tampered, TEST_WEBHOOK_SECRET, Math.floor(Date.now() / 1000) - 600),
    );
    expect(r4.status).toBe(400);
    expect(await rowsAbout(invoiceId)).toEqual(before);
  });

  it('a declined card leaves the invoice unpaid with the reason; the next card pays it', async () => {
    const invoiceId = await insertIssuedInvoice(stack.t.deps.db, owner.firmId, 8_450);
    const token = await payToken(owner.client, invoiceId);
    const { checkoutUrl, page } = await payAsCustomer(stack, owner.client, token, '4000 0000 0000 0002');
    expect(page.status).toBe(402);
    expect(await page.text()).toContain('Your card was declined.');
    let rows = await rowsAbout(invoiceId);
    expect(rows.invoice).toEqual({ status: 'issued', paid: 0 });
    expect(rows.payments).toEqual([{ status: 'failed', amount_pence: 8_450, refunded_pence: 0 }]);
    const list = await owner.client.get(`/api/invoices/${invoiceId}/payments`).expect(200);
    expect(list.body.payments[0].failureMessage).toBe('Your card was declined.');

    const retry = await fetch(checkoutUrl, {
      method: 'POST',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
      body: 'card_number=4242424242424242',
      redirect: 'manual',
    });
    expect(retry.status).toBe(303);
    await stack.fake.webhooks.settled();
    rows = await rowsAbout(invoiceId);
    expect(rows.invoice).toEqual({ status: 'paid', paid: 8_450 });
    expect(rows.payments[0]!.status).toBe('succeeded');
  });

  it('events out of order: a refund before its payment, and an old decline after the money, end right', async () => {
    const invoiceId = await insertIssuedInvoice(stack.t.deps.db, owner.firmId, 20_000);
    const token = await payToken(owner.client, invoiceId);
    stack.fake.webhooks.hold();
    const { checkoutUrl } = await payAsCustomer(stack, owner.client, token, '4000000000000002');
    await fetch(checkoutUrl, {
      method: 'POST',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
      body: 'card_number=4242424242424242',
      redirect: 'manual',
    });
    const session = await stack.stripe.checkout.sessions.retrieve(
      checkoutUrl.split('/').at(-1)!,
      {},
      { stripeAccount: accountId },
    );
    // A refund made on the service's own dashboard: only its webhook tells Heatfleet.
    await stack.stripe.refunds.create(
      { payment_intent: String(session.payment_intent), amount: 7_500 },
      { stripeAccount: accountId },
    );
    // Newest first: charge.refunded, refund.created, checkout.session.completed, payment_intent.succeeded,
    // charge.succeeded, then the decline from before the money.
    stack.fake.webhooks.release('reverse');
    await stack.fake.webhooks.settled();
    const rows = await rowsAbout(invoiceId);
    expect(rows.payments).toEqual([{ status: 'succeeded', amount_pence: 20_000, refunded_pence: 7_500 }]);
    expect(rows.invoice).toEqual({ status: 'part_paid', paid: 12_500 });
    expect(rows.receipts.map((r) => Number(r.amount_pence)).sort((a, b) => a - b)).toEqual([-7_500, 20_000]);
  });
});
