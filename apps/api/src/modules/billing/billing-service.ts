import { ForbiddenError } from '@casl/ability';
import {
  isFirmReadOnly,
  monthlyChargePence,
  readOnlyFrom,
  SUBSCRIPTION_GRACE_DAYS,
  type BillingResponse,
  type BillingStatus,
} from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { conflict } from '../../lib/http-error.ts';
import { callPaymentService, paymentClient } from '../payments/payment-client.ts';
import { findPaymentFailedAt, updateSubscription } from './billing-dal.ts';
import { fromSeconds, periodEndOf, syncVanCount } from './billing-subscription.ts';

export function statusOf(paymentFailedAt: Date | null, now: Date): BillingStatus {
  return {
    readOnly: isFirmReadOnly(paymentFailedAt, now),
    readOnlyFrom: readOnlyFrom(paymentFailedAt)?.toISOString() ?? null,
    paymentFailed: paymentFailedAt !== null,
  };
}

/** Whether the firm is read-only: every member sees it (a banner), from our own table, without the service. */
export async function getBillingStatus(deps: AppDeps, actor: Actor): Promise<BillingStatus> {
  return statusOf(await findPaymentFailedAt(deps.db, actor.firmId), deps.clock.now());
}

/** The Owner's billing page: the plan (vans x price), the card on file and the last invoices, from the service. */
export async function getBilling(deps: AppDeps, actor: Actor): Promise<BillingResponse> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Billing');
  const row = await syncVanCount(deps, actor.firmId);
  const stripe = paymentClient(deps.env);
  const live = await callPaymentService(deps.logger, 'billing read', async () => {
    const subscription = await stripe.subscriptions.retrieve(row.subscription_id);
    const customer = await stripe.customers.retrieve(row.customer_id);
    const methodRef = 'deleted' in customer ? null : customer.invoice_settings.default_payment_method;
    const method =
      methodRef === null
        ? null
        : typeof methodRef === 'string'
          ? await stripe.paymentMethods.retrieve(methodRef)
          : methodRef;
    const invoices = await stripe.invoices.list({ customer: row.customer_id, limit: 12 });
    return { subscription, method, invoices: invoices.data };
  });
  const now = deps.clock.now();
  await updateSubscription(
    deps.db,
    actor.firmId,
    {
      status: live.subscription.status,
      trial_ends_at: fromSeconds(live.subscription.trial_end),
      period_ends_at: periodEndOf(live.subscription),
    },
    now,
  );
  const card = live.method?.card;
  return {
    plan: {
      status: live.subscription.status,
      vans: row.quantity,
      unitPence: row.unit_amount_pence,
      monthlyPence: monthlyChargePence(row.quantity, row.unit_amount_pence),
      trialEndsAt: fromSeconds(live.subscription.trial_end)?.toISOString() ?? null,
      periodEndsAt: periodEndOf(live.subscription)?.toISOString() ?? null,
    },
    card: card ? { brand: card.brand, last4: card.last4, expMonth: card.exp_month, expYear: card.exp_year } : null,
    invoices: live.invoices.map((invoice) => ({
      id: invoice.id ?? '',
      number: invoice.number ?? null,
      status: invoice.status ?? 'draft',
      amountDuePence: invoice.amount_due,
      amountPaidPence: invoice.amount_paid,
      createdAt: new Date(invoice.created * 1000).toISOString(),
      url: invoice.hosted_invoice_url ?? null,
    })),
    status: statusOf(row.payment_failed_at, now),
    graceDays: SUBSCRIPTION_GRACE_DAYS,
  };
}

/** The service's hosted page to save a card for the subscription (card numbers never touch our pages). */
export async function startCardSetup(deps: AppDeps, actor: Actor): Promise<{ url: string }> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Billing');
  const row = await syncVanCount(deps, actor.firmId);
  const billing = new URL('/billing', deps.env.APP_ORIGIN).toString();
  const session = await callPaymentService(deps.logger, 'checkout.sessions.create (setup)', () =>
    paymentClient(deps.env).checkout.sessions.create({
      mode: 'setup',
      customer: row.customer_id,
      currency: 'gbp',
      metadata: { firmId: String(actor.firmId), purpose: 'subscription-card' },
      success_url: `${billing}?card=saved`,
      cancel_url: billing,
    }),
  );
  if (!session.url) throw conflict('The card page could not be opened. Please try again.');
  return { url: session.url };
}

/** Pays the unpaid subscription invoice with the card on file; paying lifts a read-only firm at once (Owner, Admin). */
export async function payOpenInvoice(deps: AppDeps, actor: Actor): Promise<BillingResponse> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Billing');
  const row = await syncVanCount(deps, actor.firmId);
  const stripe = paymentClient(deps.env);
  const open = await callPaymentService(deps.logger, 'invoices.list', () =>
    stripe.invoices.list({ customer: row.customer_id, status: 'open', limit: 1 }),
  );
  const invoiceId = open.data[0]?.id;
  // Nothing owed: nothing to do, and the page shows so.
  if (!invoiceId) return getBilling(deps, actor);
  await callPaymentService(deps.logger, 'invoices.pay', () => stripe.invoices.pay(invoiceId));
  await updateSubscription(deps.db, actor.firmId, { status: 'active', payment_failed_at: null }, deps.clock.now());
  return getBilling(deps, actor);
}
