import type { Knex } from 'knex';
import { amountDue, invoiceStateAfterPayments, type InvoiceState } from '@heatfleet/domain';
import { createToken, hashToken } from '../../lib/tokens.ts';
import { conflict, notFound } from '../../lib/http-error.ts';
import {
  findInvoice,
  findPayToken,
  insertPayToken,
  insertReceiptOnce,
  setInvoiceMoney,
  type InvoiceRow,
} from './invoice-dal.ts';

// What the payments module calls (DEVELOPERS.md, "Money"): apply money to an invoice once per reference,
// make the pay link an e-mail or QR code carries, and find the invoice a pay link opens.

/** How long a pay link works: 120 days, beyond the second overdue reminder. */
export const PAY_LINK_DAYS = 120;

export interface InvoicePaymentOutcome {
  /** False when this paymentRef was applied before (nothing changed). */
  applied: boolean;
  status: InvoiceState;
  paidPence: number;
  duePence: number;
}

export function invoiceMoneyOf(row: InvoiceRow) {
  return {
    issued: row.status !== 'draft',
    totalPence: Number(row.total_pence),
    paidPence: Number(row.paid_pence),
    creditedPence: Number(row.credited_pence),
  };
}

/**
 * Applies a payment (amountPence > 0) or a refund (amountPence < 0) to an issued invoice in the caller's
 * transaction, once per paymentRef (a repeated webhook changes nothing and answers applied: false). The
 * invoice row is locked first, so concurrent payments add up; its state follows from the domain's
 * invoiceStateAfterPayments. 404 for another firm's invoice, 409 for a draft one.
 */
export async function recordInvoicePayment(
  trx: Knex.Transaction,
  firmId: number,
  invoiceId: number,
  amountPence: number,
  paymentRef: string,
  receivedAt: Date = new Date(),
): Promise<InvoicePaymentOutcome> {
  if (!Number.isSafeInteger(amountPence) || amountPence === 0)
    throw new RangeError('A payment is a non-zero whole number of pence.');
  const row = await findInvoice(trx, firmId, invoiceId, { forUpdate: true });
  if (!row) throw notFound('The invoice');
  if (row.status === 'draft') throw conflict('This invoice has not been issued yet, so it cannot be paid.');
  const applied = await insertReceiptOnce(trx, {
    firm_id: firmId,
    invoice_id: invoiceId,
    payment_ref: paymentRef,
    amount_pence: amountPence,
    received_at: receivedAt,
  });
  const money = invoiceMoneyOf(row);
  if (applied) {
    money.paidPence += amountPence;
    const status = invoiceStateAfterPayments(money);
    await setInvoiceMoney(trx, firmId, invoiceId, {
      paid_pence: money.paidPence,
      credited_pence: money.creditedPence,
      status,
    });
  }
  return {
    applied,
    status: invoiceStateAfterPayments(money),
    paidPence: money.paidPence,
    duePence: amountDue(money),
  };
}

/**
 * A new link to pay the invoice: `${APP_ORIGIN}/pay/<token>`, a 32-byte token of which only the SHA-256
 * is kept, valid PAY_LINK_DAYS. Each e-mail or QR code gets its own; all of them open the same invoice.
 */
export async function invoicePayLink(
  trx: Knex.Transaction,
  appOrigin: string,
  firmId: number,
  invoiceId: number,
  now: Date = new Date(),
): Promise<string> {
  const { token, tokenHash } = createToken();
  await insertPayToken(trx, {
    firm_id: firmId,
    invoice_id: invoiceId,
    token_hash: tokenHash,
    expires_at: new Date(now.getTime() + PAY_LINK_DAYS * 86_400_000),
  });
  return new URL(`/pay/${token}`, appOrigin).toString();
}

/** The firm and invoice a pay link opens; undefined for an unknown or expired token. */
export async function invoiceForPayToken(
  db: Knex | Knex.Transaction,
  token: string,
  now: Date = new Date(),
): Promise<{ firmId: number; invoiceId: number } | undefined> {
  return findPayToken(db, hashToken(token), now);
}
