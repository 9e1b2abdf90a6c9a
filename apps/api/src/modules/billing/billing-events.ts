import type { Knex } from 'knex';
import type Stripe from 'stripe';
import { formatPence, readOnlyFrom } from '@heatfleet/domain';
import type { AppDeps } from '../../app-deps.ts';
import { insertEmail } from '../mail/mail-dal.ts';
import {
  activeOwnerEmails,
  findPaymentFailedAt,
  findSubscriptionByCustomer,
  markPaymentFailed,
  updateSubscription,
  type SubscriptionRow,
} from './billing-dal.ts';
import { fromSeconds, periodEndOf } from './billing-subscription.ts';

/** A platform event about a firm's subscription, with what was read back from the service before the transaction. */
export interface BillingEvent {
  row: SubscriptionRow;
  event: Stripe.Event;
  /** The subscription or invoice as the service holds it now: events may arrive late or out of order. */
  subscription?: Stripe.Subscription;
  invoice?: Stripe.Invoice;
}

function customerOf(object: { customer?: string | Stripe.Customer | Stripe.DeletedCustomer | null }): string | null {
  const customer = object.customer;
  if (!customer) return null;
  return typeof customer === 'string' ? customer : customer.id;
}

/** Which firm a platform event is about, and the current state behind it (read outside any transaction). */
export async function prepareBillingEvent(
  deps: AppDeps,
  stripe: Stripe,
  event: Stripe.Event,
): Promise<BillingEvent | null> {
  const object = event.data.object as { customer?: string | Stripe.Customer | null };
  const customerId = customerOf(object);
  if (!customerId) return null;
  const row = await findSubscriptionByCustomer(deps.db, customerId);
  if (!row) return null;
  if (event.type.startsWith('customer.subscription.')) {
    return { row, event, subscription: await stripe.subscriptions.retrieve(row.subscription_id) };
  }
  if (event.type === 'invoice.paid' || event.type === 'invoice.payment_failed') {
    const invoice = event.data.object;
    return { row, event, invoice: invoice.id ? await stripe.invoices.retrieve(invoice.id) : invoice };
  }
  if (event.type === 'checkout.session.completed') {
    const session = event.data.object;
    if (session.mode !== 'setup' || typeof session.setup_intent !== 'string') return null;
    const intent = await stripe.setupIntents.retrieve(session.setup_intent);
    const method = typeof intent.payment_method === 'string' ? intent.payment_method : intent.payment_method?.id;
    if (method) await stripe.customers.update(customerId, { invoice_settings: { default_payment_method: method } });
    // A new card settles what is owed straight away, as the service's own retry would later.
    const open = await stripe.invoices.list({ customer: customerId, status: 'open', limit: 1 });
    const owed = open.data[0];
    if (owed?.id) {
      const owedId = owed.id;
      const paid = await stripe.invoices.pay(owedId).catch(() => null);
      if (paid) return { row, event, invoice: paid };
    }
    return { row, event };
  }
  return null;
}

/** Applies a prepared billing event inside the webhook's transaction; answers the e-mail ids to send after commit. */
export async function applyBillingEvent(
  deps: AppDeps,
  trx: Knex.Transaction,
  prepared: BillingEvent,
  now: Date,
): Promise<number[]> {
  const { row, subscription, invoice } = prepared;
  if (subscription) {
    await updateSubscription(
      trx,
      row.firm_id,
      {
        status: subscription.status,
        quantity: subscription.items.data[0]?.quantity ?? row.quantity,
        trial_ends_at: fromSeconds(subscription.trial_end),
        period_ends_at: periodEndOf(subscription),
        ...(subscription.status === 'active' || subscription.status === 'trialing' ? { payment_failed_at: null } : {}),
      },
      now,
    );
    return [];
  }
  if (invoice?.status === 'paid') {
    // Paying lifts a read-only firm at once.
    await updateSubscription(trx, row.firm_id, { status: 'active', payment_failed_at: null }, now);
    return [];
  }
  if (invoice && prepared.event.type === 'invoice.payment_failed' && invoice.status === 'open') {
    await markPaymentFailed(trx, row.firm_id, now);
    const from = readOnlyFrom((await findPaymentFailedAt(trx, row.firm_id)) ?? now)!;
    const billing = new URL('/billing', deps.env.APP_ORIGIN).toString();
    const when = from.toLocaleDateString('en-GB', {
      day: 'numeric',
      month: 'long',
      year: 'numeric',
      timeZone: 'Europe/London',
    });
    const ids: number[] = [];
    for (const to of await activeOwnerEmails(trx, row.firm_id)) {
      ids.push(
        await insertEmail(trx, {
          firmId: row.firm_id,
          to,
          subject: 'Your Heatfleet payment did not go through',
          text: [
            `We could not take this month's Heatfleet payment of ${formatPence(invoice.amount_due)}.`,
            `Nothing has changed yet. If it is still unpaid on ${when}, your firm's records become read-only until it is paid: everything stays readable and exportable, and nothing is deleted.`,
            `Pay it or change the card here: ${billing}`,
          ].join('\n\n'),
          html: null,
          purpose: 'reminder',
        }),
      );
    }
    return ids;
  }
  return [];
}
