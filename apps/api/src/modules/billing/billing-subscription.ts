import type Stripe from 'stripe';
import { SUBSCRIPTION_TRIAL_DAYS } from '@heatfleet/domain';
import type { AppDeps } from '../../app-deps.ts';
import { notFound } from '../../lib/http-error.ts';
import { callPaymentService, paymentClient } from '../payments/payment-client.ts';
import {
  countActiveVans,
  findSubscription,
  firmForBilling,
  insertSubscriptionOnce,
  updateSubscription,
  type SubscriptionRow,
} from './billing-dal.ts';

const DAY_MS = 86_400_000;
export const fromSeconds = (s: number | null | undefined) => (s ? new Date(s * 1000) : null);

/** The per-van monthly price, made once on the platform account and found again by its lookup key. */
async function vanPrice(deps: AppDeps): Promise<Stripe.Price> {
  const stripe = paymentClient(deps.env);
  const lookupKey = `heatfleet-van-monthly-${deps.env.BILLING_VAN_PRICE_PENCE}`;
  const found = await stripe.prices.list({ lookup_keys: [lookupKey], limit: 1 });
  if (found.data[0]) return found.data[0];
  return stripe.prices.create(
    {
      currency: 'gbp',
      unit_amount: deps.env.BILLING_VAN_PRICE_PENCE,
      recurring: { interval: 'month' },
      product_data: { name: 'Heatfleet, per active van' },
      lookup_key: lookupKey,
    },
    { idempotencyKey: lookupKey },
  );
}

export function periodEndOf(subscription: Stripe.Subscription): Date | null {
  return fromSeconds(subscription.items.data[0]?.current_period_end);
}

/**
 * The firm's subscription, made the first time it is needed: a customer for the firm, one item of the van price
 * with quantity = active vans, and the trial counted from the firm's sign-up (30 days; a firm already older
 * than that when billing began gets its 30 days from now). Idempotency keys keep two first calls to one.
 */
export async function ensureSubscription(deps: AppDeps, firmId: number): Promise<SubscriptionRow> {
  const existing = await findSubscription(deps.db, firmId);
  if (existing) return existing;
  const firm = await firmForBilling(deps.db, firmId);
  if (!firm) throw notFound('That firm');
  const stripe = paymentClient(deps.env);
  const vans = await countActiveVans(deps.db, firmId);
  const now = deps.clock.now();
  let trialEnd = new Date(firm.created_at.getTime() + SUBSCRIPTION_TRIAL_DAYS * DAY_MS);
  if (trialEnd.getTime() < now.getTime() + DAY_MS)
    trialEnd = new Date(now.getTime() + SUBSCRIPTION_TRIAL_DAYS * DAY_MS);
  const created = await callPaymentService(deps.logger, 'subscriptions.create', async () => {
    const price = await vanPrice(deps);
    const customer = await stripe.customers.create(
      { name: firm.name, metadata: { firmId: String(firmId) } },
      { idempotencyKey: `heatfleet-firm-customer-${firmId}` },
    );
    const subscription = await stripe.subscriptions.create(
      {
        customer: customer.id,
        items: [{ price: price.id, quantity: vans }],
        trial_period_days: Math.round((trialEnd.getTime() - now.getTime()) / DAY_MS),
        metadata: { firmId: String(firmId) },
      },
      { idempotencyKey: `heatfleet-firm-subscription-${firmId}` },
    );
    return { customer, subscription, price };
  });
  const item = created.subscription.items.data[0]!;
  await insertSubscriptionOnce(deps.db, {
    firm_id: firmId,
    customer_id: created.customer.id,
    subscription_id: created.subscription.id,
    item_id: item.id,
    status: created.subscription.status,
    quantity: item.quantity ?? vans,
    unit_amount_pence: created.price.unit_amount ?? deps.env.BILLING_VAN_PRICE_PENCE,
    trial_ends_at: fromSeconds(created.subscription.trial_end),
    period_ends_at: periodEndOf(created.subscription),
  });
  return (await findSubscription(deps.db, firmId))!;
}

/**
 * Sets the subscription's quantity to the firm's active vans, prorated by the service for the rest of the month.
 * Counted again after each change, so two vans added at once end at the right number whichever call lands last.
 */
export async function syncVanCount(deps: AppDeps, firmId: number): Promise<SubscriptionRow> {
  let row = await ensureSubscription(deps, firmId);
  for (let attempt = 0; attempt < 3; attempt += 1) {
    const vans = await countActiveVans(deps.db, firmId);
    if (vans === row.quantity) return row;
    const { subscription_id: subscriptionId, item_id: itemId } = row;
    const updated = await callPaymentService(deps.logger, 'subscriptions.update', () =>
      paymentClient(deps.env).subscriptions.update(subscriptionId, {
        items: [{ id: itemId, quantity: vans }],
        proration_behavior: 'create_prorations',
      }),
    );
    await updateSubscription(
      deps.db,
      firmId,
      { quantity: updated.items.data[0]?.quantity ?? vans, status: updated.status },
      deps.clock.now(),
    );
    row = (await findSubscription(deps.db, firmId))!;
  }
  return row;
}

/** After a van is added or retired: never fails the van's own change (the billing page reconciles later). */
export async function syncVanCountAfterChange(deps: AppDeps, firmId: number): Promise<void> {
  try {
    await syncVanCount(deps, firmId);
  } catch (error) {
    deps.logger.warn({ err: error, firmId }, 'subscription quantity not updated; the billing page will retry');
  }
}
