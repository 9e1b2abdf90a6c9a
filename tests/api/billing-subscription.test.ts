import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, signUpFirm, type Client, type SignedUp } from './support/test-app.ts';
import { postForm, startPaymentStack, type PaymentStack } from './support/payment-stack.ts';

// The firm's own subscription (issue 15; README, Payments): per active van, monthly, prorated when a van is added
// or retired, a 30-day trial, and read-only 14 days after a failed payment until it is paid. Proration and trial
// semantics follow the payment service's subscription reference (from memory); the grace period is a product rule.
const DAY_MS = 86_400_000;
let stack: PaymentStack;
let owner: SignedUp;

beforeAll(async () => {
  stack = await startPaymentStack();
  owner = await signUpFirm(stack.t.app, 'billing');
});
afterAll(() => stack.close());

let vanCount = 0;
async function addVan(client: Client) {
  vanCount += 1;
  return client.post('/api/vans', { name: `Billing van ${vanCount}`, registration: `BV${10 + vanCount} ABC` });
}

async function subscriptionRow() {
  return (await stack.t.deps.db('firm_subscriptions').where({ firm_id: owner.firmId }).first()) as {
    subscription_id: string;
    quantity: number;
    status: string;
    trial_ends_at: Date;
  };
}

async function serviceQuantity(): Promise<number> {
  const sub = await stack.stripe.subscriptions.retrieve((await subscriptionRow()).subscription_id);
  return sub.items.data[0]!.quantity!;
}

describe('the subscription follows the vans', () => {
  it('starts on a 30-day trial counted from sign-up, quantity = active vans', async () => {
    expect((await addVan(owner.client)).status).toBe(201);
    const row = await subscriptionRow();
    expect(row.status).toBe('trialing');
    expect(row.quantity).toBe(1);
    expect(await serviceQuantity()).toBe(1);
    const firm = (await stack.t.deps.db('firms').where({ id: owner.firmId }).first('created_at')) as {
      created_at: Date;
    };
    const trialDays = (row.trial_ends_at.getTime() - firm.created_at.getTime()) / DAY_MS;
    expect(Math.abs(trialDays - 30)).toBeLessThan(1);
  });

  it('a van added and one retired move the quantity both ways', async () => {
    const second = await addVan(owner.client);
    await addVan(owner.client);
    expect(await serviceQuantity()).toBe(3);
    expect((await owner.client.patch(`/api/vans/${second.body.van.id}`, { active: false })).status).toBe(200);
    expect(await serviceQuantity()).toBe(2);
    const billing = await owner.client.get('/api/billing').expect(200);
    expect(billing.body.plan).toMatchObject({ status: 'trialing', vans: 2, unitPence: 1500, monthlyPence: 3000 });
    expect(billing.body.card).toBeNull();
  });
});

describe('a failed payment, the grace period and paying', () => {
  it('reminds the owner, turns read-only after 14 days, keeps reads and exports, and lifts at once on payment', async () => {
    const { subscription_id: subscriptionId } = await subscriptionRow();
    // The trial ends with no card on file: the first invoice cannot be paid.
    const advanced = await fetch(`${stack.fake.url}/_payfake/subscriptions/${subscriptionId}/advance`, {
      method: 'POST',
    });
    expect(((await advanced.json()) as { status: string; amount_due: number }).amount_due).toBe(3000);
    await stack.fake.webhooks.settled();
    const reminder = (await stack.t.deps
      .db('emails')
      .where({ firm_id: owner.firmId, subject: 'Your Heatfleet payment did not go through' })
      .first('to_address', 'text_body')) as { to_address: string; text_body: string };
    expect(reminder.to_address).toBe(owner.email);
    expect(reminder.text_body).toContain('£30.00');

    // Within the grace period everything still works.
    let status = await owner.client.get('/api/billing/status').expect(200);
    expect(status.body).toMatchObject({ readOnly: false, paymentFailed: true });
    expect((await addVan(owner.client)).status).toBe(201);

    stack.t.clock.advance(14 * DAY_MS);
    const client = await signIn(stack.t.app, owner.email);
    const vansBefore = await client.get('/api/vans').expect(200);
    const refused = await addVan(client);
    expect(refused.status).toBe(403);
    expect(refused.body).toMatchObject({
      error: 'FirmReadOnly',
      message: 'This firm is read-only until its subscription is paid.',
    });
    expect((await client.put('/api/firm', { name: 'Renamed while read-only' })).status).toBe(403);
    expect((await client.get('/api/vans').expect(200)).body).toEqual(vansBefore.body);
    expect((await client.get('/api/stock/movements.csv')).status).toBe(200);
    status = await client.get('/api/billing/status').expect(200);
    expect(status.body.readOnly).toBe(true);

    // The owner saves a card on the service's page; the unpaid invoice is paid with it and the firm opens at once.
    const cardLink = await client.post('/api/billing/card');
    expect(cardLink.status).toBe(200);
    const saved = await postForm(cardLink.body.url as string, { card_number: '4242424242424242', expiry: '11 / 30' });
    expect(saved.status).toBe(303);
    await stack.fake.webhooks.settled();
    status = await client.get('/api/billing/status').expect(200);
    expect(status.body).toEqual({ readOnly: false, readOnlyFrom: null, paymentFailed: false });
    expect((await addVan(client)).status).toBe(201);
    const billing = await client.get('/api/billing').expect(200);
    expect(billing.body.card).toEqual({ brand: 'visa', last4: '4242', expMonth: 11, expYear: 2030 });
    expect(billing.body.invoices[0]).toMatchObject({ status: 'paid', amountPaidPence: 3000 });
  });

  it('a van added in a paid month is charged for the rest of it on the next invoice', async () => {
    const { subscription_id: subscriptionId } = await subscriptionRow();
    const res = await fetch(`${stack.fake.url}/_payfake/subscriptions/${subscriptionId}/advance`, { method: 'POST' });
    const invoice = (await res.json()) as { status: string; lines: { data: { amount: number; quantity: number }[] } };
    // 4 vans at £15 for the new month, plus the two vans added in the month before, each for the rest of that
    // month (both added just after it began, so close to a whole £15 each).
    expect(invoice.lines.data[0]).toMatchObject({ quantity: 4, amount: 6000 });
    const prorations = invoice.lines.data.slice(1).map((line) => line.amount);
    expect(prorations).toHaveLength(2);
    for (const amount of prorations) {
      expect(amount).toBeGreaterThan(1400);
      expect(amount).toBeLessThanOrEqual(1500);
    }
    expect(invoice.status).toBe('paid');
  });
});
