import type Stripe from 'stripe';
import type { AppDeps } from '../../app-deps.ts';
import { withTransactionRetry } from '../../db/with-retry.ts';
import { HttpError } from '../../lib/http-error.ts';
import { applyBillingEvent, prepareBillingEvent } from '../billing/billing-events.ts';
import { callPaymentService, paymentClient } from './payment-client.ts';
import { eventSeen, findPaymentAccountByProviderId, insertEventOnce, setPaymentAccountStatus } from './payment-dal.ts';
import { applyPaymentEvent } from './payment-events.ts';

const badSignature = () =>
  new HttpError(400, 'This event is not signed by the payment service (its signature does not match).', 'BadSignature');

/**
 * One webhook from the payment service. The signature is checked over the raw bytes with the SDK's own verifier
 * (HMAC-SHA256 with the endpoint's secret, 5 minutes' tolerance); then the event is applied at most once: its id
 * is stored in the same transaction as the change, so a repeat, however late, is acknowledged and does nothing.
 * Any failure here answers 5xx and the service sends the event again.
 */
export async function receiveWebhook(
  deps: AppDeps,
  rawBody: unknown,
  signature: string | undefined,
): Promise<{ received: true; applied: boolean }> {
  if (!Buffer.isBuffer(rawBody) || !signature) throw badSignature();
  const stripe = paymentClient(deps.env);
  let event: Stripe.Event;
  try {
    event = stripe.webhooks.constructEvent(rawBody, signature, deps.env.STRIPE_WEBHOOK_SECRET);
  } catch {
    throw badSignature();
  }
  if (await eventSeen(deps.db, event.id)) return { received: true, applied: false };
  const now = deps.clock.now();

  if (!event.account) {
    const prepared = await callPaymentService(deps.logger, `webhook ${event.type}`, () =>
      prepareBillingEvent(deps, stripe, event),
    );
    if (!prepared) return { received: true, applied: false };
    const emails = await withTransactionRetry(() =>
      deps.db.transaction(async (trx) => {
        const fresh = await insertEventOnce(trx, {
          firm_id: prepared.row.firm_id,
          event_id: event.id,
          type: event.type,
          received_at: now,
        });
        return fresh ? applyBillingEvent(deps, trx, prepared, now) : null;
      }),
    );
    if (emails === null) return { received: true, applied: false };
    if (emails.length > 0) await deps.mailQueue.notify(emails);
    return { received: true, applied: true };
  }

  const account = await findPaymentAccountByProviderId(deps.db, event.account);
  if (!account) return { received: true, applied: false };
  const firmId = account.firm_id;
  // The service sends a payment's events together: two may lock the same payment at once (a deadlock is retried).
  const applied = await withTransactionRetry(() =>
    deps.db.transaction(async (trx) => {
      if (!(await insertEventOnce(trx, { firm_id: firmId, event_id: event.id, type: event.type, received_at: now }))) {
        return false;
      }
      if (event.type === 'account.updated') {
        const object = event.data.object;
        await setPaymentAccountStatus(
          trx,
          firmId,
          { chargesEnabled: object.charges_enabled, detailsSubmitted: object.details_submitted },
          now,
        );
        return true;
      }
      return applyPaymentEvent(trx, firmId, event, now);
    }),
  );
  return { received: true, applied };
}
