import type { Knex } from 'knex';
import type { Payment } from '@heatfleet/domain';
import { listInvoicePayments, listRefunds } from './payment-dal.ts';

/** The payments made against an invoice, newest first, each with its refunds. */
export async function paymentsOfInvoice(db: Knex, firmId: number, invoiceId: number): Promise<Payment[]> {
  const rows = await listInvoicePayments(db, firmId, invoiceId);
  const refunds = await listRefunds(
    db,
    firmId,
    rows.map((r) => r.id),
  );
  return rows.map((row) => ({
    id: row.id,
    invoiceId: row.invoice_id,
    amountPence: Number(row.amount_pence),
    refundedPence: Number(row.refunded_pence),
    status: row.status,
    failureMessage: row.failure_message,
    startedFrom: row.started_from,
    paidAt: row.paid_at?.toISOString() ?? null,
    createdAt: row.created_at.toISOString(),
    refunds: refunds
      .filter((r) => r.payment_id === row.id)
      .map((r) => ({
        id: r.id,
        amountPence: Number(r.amount_pence),
        reason: r.reason,
        createdAt: r.created_at.toISOString(),
      })),
  }));
}
