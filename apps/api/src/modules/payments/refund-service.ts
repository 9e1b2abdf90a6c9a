import { ForbiddenError } from '@casl/ability';
import { formatPence, type Payment, type RefundInput } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { conflict, notFound, ruleBroken } from '../../lib/http-error.ts';
import { callPaymentService, paymentClient } from './payment-client.ts';
import { findPayment, findPaymentAccount, findPaymentForEvent, insertRefundOnce } from './payment-dal.ts';
import { applyRefundedTotal } from './payment-events.ts';
import { paymentsOfInvoice } from './payment-read.ts';

/**
 * Refunds a card payment in full (no amount) or in part, through the firm's own account. The request's
 * Idempotency-Key goes on to the service, so a retried tap gets the same refund back, never a second one; the
 * invoice follows at once (and again, harmlessly, when the charge.refunded webhook arrives).
 */
export async function refundPayment(
  deps: AppDeps,
  actor: Actor,
  paymentId: number,
  input: RefundInput,
  idempotencyKey: string | undefined,
): Promise<Payment> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Payment');
  const payment = await findPayment(deps.db, actor.firmId, paymentId);
  if (!payment) throw notFound('That payment');
  if (payment.status !== 'succeeded' || !payment.payment_intent_id) {
    throw conflict('Only a payment that went through can be refunded.');
  }
  const left = payment.amount_pence - payment.refunded_pence;
  if (left === 0) throw conflict('This payment has already been refunded in full.');
  const amount = input.amountPence ?? left;
  if (amount > left) {
    throw ruleBroken(
      `You can refund at most ${formatPence(left)} of this payment (you asked for ${formatPence(amount)}).`,
      [{ path: 'amountPence', message: `At most ${formatPence(left)}.` }],
    );
  }
  const account = await findPaymentAccount(deps.db, actor.firmId);
  if (!account) throw conflict('The firm has no payment account to refund from.');
  const stripe = paymentClient(deps.env);
  const intentId = payment.payment_intent_id;
  const options = {
    stripeAccount: account.provider_account_id,
    ...(idempotencyKey ? { idempotencyKey: `refund-${actor.firmId}-${paymentId}-${idempotencyKey}` } : {}),
  };
  const refund = await callPaymentService(deps.logger, 'refunds.create', () =>
    stripe.refunds.create(
      { payment_intent: intentId, amount, reason: 'requested_by_customer', metadata: { paymentId: String(paymentId) } },
      options,
    ),
  );
  const chargeId = typeof refund.charge === 'string' ? refund.charge : refund.charge?.id;
  const charge = chargeId
    ? await callPaymentService(deps.logger, 'charges.retrieve', () =>
        stripe.charges.retrieve(chargeId, {}, { stripeAccount: account.provider_account_id }),
      )
    : null;
  const now = deps.clock.now();
  await deps.db.transaction(async (trx) => {
    await insertRefundOnce(trx, {
      firm_id: actor.firmId,
      payment_id: paymentId,
      provider_refund_id: refund.id,
      amount_pence: refund.amount,
      reason: input.reason ?? null,
      created_by_user_id: actor.userId,
    });
    const locked = await findPaymentForEvent(trx, actor.firmId, { paymentIntentId: intentId });
    if (locked && charge) await applyRefundedTotal(trx, actor.firmId, locked, charge.id, charge.amount_refunded, now);
  });
  const payments = await paymentsOfInvoice(deps.db, actor.firmId, payment.invoice_id);
  return payments.find((p) => p.id === paymentId)!;
}
