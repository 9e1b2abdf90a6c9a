import type { Knex } from 'knex';
import type Stripe from 'stripe';
import { recordInvoicePayment } from '../money/invoice-payments.ts';
import { findPaymentForEvent, insertPayment, updatePayment, type PaymentRow } from './payment-dal.ts';

type Meta = Record<string, string> | null | undefined;

interface PaymentFacts {
  metadata: Meta;
  paymentIntentId?: string;
  checkoutSessionId?: string;
}

/**
 * The payment an event is about: by our reference (in the metadata), the payment intent or the session. A
 * payment whose row was never written (our write failed after the session was made) is written from the
 * metadata the session carries, so money that arrived is never lost.
 */
async function paymentFor(
  trx: Knex.Transaction,
  firmId: number,
  facts: PaymentFacts,
  amountPence: number,
): Promise<PaymentRow | undefined> {
  const reference = facts.metadata?.paymentReference;
  const ref = { reference, paymentIntentId: facts.paymentIntentId, checkoutSessionId: facts.checkoutSessionId };
  const found = await findPaymentForEvent(trx, firmId, ref);
  if (found) return found;
  const invoiceId = Number(facts.metadata?.invoiceId);
  if (!reference || !Number.isInteger(invoiceId) || Number(facts.metadata?.firmId) !== firmId) return undefined;
  await insertPayment(trx, {
    firm_id: firmId,
    invoice_id: invoiceId,
    reference,
    checkout_session_id: facts.checkoutSessionId ?? `unknown:${reference}`,
    payment_intent_id: facts.paymentIntentId ?? null,
    amount_pence: amountPence,
    started_from: 'email_link',
    status: 'pending',
  });
  return findPaymentForEvent(trx, firmId, ref);
}

/** Money received: the payment succeeds and the invoice is paid once per payment intent, whichever event comes first. */
async function applySuccess(
  trx: Knex.Transaction,
  firmId: number,
  payment: PaymentRow,
  paymentIntentId: string,
  amountPence: number,
  now: Date,
): Promise<void> {
  if (payment.status !== 'succeeded') {
    await updatePayment(
      trx,
      firmId,
      payment.id,
      {
        status: 'succeeded',
        payment_intent_id: paymentIntentId,
        amount_pence: amountPence,
        failure_message: null,
        paid_at: now,
      },
      now,
    );
    payment.status = 'succeeded';
    payment.payment_intent_id = paymentIntentId;
  }
  await recordInvoicePayment(trx, firmId, payment.invoice_id, amountPence, paymentIntentId, now);
}

/**
 * The charge's running total of refunds, from a webhook or from the refund's own answer: it sets the payment's
 * refunded sum and takes only the difference off the invoice, so a late or repeated report never counts twice.
 */
export async function applyRefundedTotal(
  trx: Knex.Transaction,
  firmId: number,
  payment: PaymentRow,
  chargeId: string,
  amountRefunded: number,
  now: Date,
): Promise<boolean> {
  const more = amountRefunded - payment.refunded_pence;
  if (more <= 0) return false;
  await updatePayment(trx, firmId, payment.id, { refunded_pence: amountRefunded }, now);
  payment.refunded_pence = amountRefunded;
  await recordInvoicePayment(trx, firmId, payment.invoice_id, -more, `${chargeId}:refunded-to:${amountRefunded}`, now);
  return true;
}

/** Applies one connected account's event to the firm's payments; answers whether anything was about a payment. */
export async function applyPaymentEvent(
  trx: Knex.Transaction,
  firmId: number,
  event: Stripe.Event,
  now: Date,
): Promise<boolean> {
  switch (event.type) {
    case 'checkout.session.completed': {
      const session = event.data.object;
      if (session.mode !== 'payment' || session.payment_status !== 'paid') return false;
      const intentId = typeof session.payment_intent === 'string' ? session.payment_intent : session.payment_intent?.id;
      const amount = session.amount_total ?? 0;
      const payment = await paymentFor(
        trx,
        firmId,
        { metadata: session.metadata, paymentIntentId: intentId, checkoutSessionId: session.id },
        amount,
      );
      if (!payment || !intentId) return false;
      await applySuccess(trx, firmId, payment, intentId, amount, now);
      return true;
    }
    case 'payment_intent.succeeded': {
      const intent = event.data.object;
      const payment = await paymentFor(
        trx,
        firmId,
        { metadata: intent.metadata, paymentIntentId: intent.id },
        intent.amount_received,
      );
      if (!payment) return false;
      await applySuccess(trx, firmId, payment, intent.id, intent.amount_received, now);
      return true;
    }
    case 'payment_intent.payment_failed': {
      const intent = event.data.object;
      const payment = await paymentFor(
        trx,
        firmId,
        { metadata: intent.metadata, paymentIntentId: intent.id },
        intent.amount,
      );
      // A decline that arrives after the money (the customer tried another card) changes nothing.
      if (!payment || payment.status === 'succeeded') return false;
      const message = intent.last_payment_error?.message ?? 'The card was declined.';
      await updatePayment(
        trx,
        firmId,
        payment.id,
        { status: 'failed', payment_intent_id: intent.id, failure_message: message.slice(0, 255) },
        now,
      );
      return true;
    }
    case 'checkout.session.expired': {
      const session = event.data.object;
      const payment = await findPaymentForEvent(trx, firmId, { checkoutSessionId: session.id });
      if (!payment || payment.status !== 'pending') return false;
      await updatePayment(trx, firmId, payment.id, { status: 'expired' }, now);
      return true;
    }
    case 'charge.refunded': {
      const charge = event.data.object;
      const intentId = typeof charge.payment_intent === 'string' ? charge.payment_intent : charge.payment_intent?.id;
      if (!intentId) return false;
      const payment = await paymentFor(
        trx,
        firmId,
        { metadata: charge.metadata, paymentIntentId: intentId },
        charge.amount,
      );
      if (!payment) return false;
      // A refund proves the payment: if its success has not arrived yet, apply it first.
      if (payment.status !== 'succeeded') await applySuccess(trx, firmId, payment, intentId, charge.amount, now);
      return applyRefundedTotal(trx, firmId, payment, charge.id, charge.amount_refunded, now);
    }
    default:
      return false;
  }
}
