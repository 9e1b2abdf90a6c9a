import type { Knex } from 'knex';
import { amountDue, documentNumber, type CreditNote, type Invoice, type InvoiceSummary } from '@heatfleet/domain';
import { listCreditNotes } from './credit-note-dal.ts';
import type { InvoiceRow } from './invoice-dal.ts';
import { invoiceMoneyOf } from './invoice-payments.ts';
import { listLines } from './money-line-dal.ts';

type Db = Knex | Knex.Transaction;

const iso = (d: Date | string | null) => (d === null ? null : new Date(d).toISOString());

export function invoiceSummary(r: InvoiceRow): InvoiceSummary {
  return {
    id: r.id,
    number: r.number === null ? null : documentNumber('invoice', r.number),
    status: r.status,
    jobId: r.job_id,
    quoteId: r.quote_id,
    customerId: r.customer_id,
    customerName: r.customer_name,
    customerAddress: r.customer_address,
    customerEmail: r.customer_email,
    firmName: r.firm_name,
    firmAddress: r.firm_address,
    vatNumber: r.vat_number,
    vatRegistered: Boolean(r.vat_registered),
    suppliedAt: iso(r.supplied_at),
    issuedAt: iso(r.issued_at),
    dueOn: r.due_on,
    netPence: Number(r.net_pence),
    vatPence: Number(r.vat_pence),
    totalPence: Number(r.total_pence),
    paidPence: Number(r.paid_pence),
    creditedPence: Number(r.credited_pence),
    duePence: amountDue(invoiceMoneyOf(r)),
    createdAt: iso(r.created_at)!,
  };
}

export async function creditNotesOf(db: Db, firmId: number, invoice: InvoiceRow): Promise<CreditNote[]> {
  const notes = await listCreditNotes(db, firmId, { invoiceId: invoice.id });
  const lines = await listLines(
    db,
    'credit_note_lines',
    firmId,
    notes.map((n) => n.id),
  );
  return notes.map((n) => ({
    id: n.id,
    number: documentNumber('credit_note', n.number),
    invoiceId: invoice.id,
    invoiceNumber: invoice.number === null ? '' : documentNumber('invoice', invoice.number),
    reason: n.reason,
    issuedAt: new Date(n.issued_at).toISOString(),
    lines: lines.get(n.id) ?? [],
    netPence: Number(n.net_pence),
    vatPence: Number(n.vat_pence),
    totalPence: Number(n.total_pence),
  }));
}

export async function invoiceAnswer(db: Db, firmId: number, r: InvoiceRow): Promise<Invoice> {
  const [lines, creditNotes] = await Promise.all([
    listLines(db, 'invoice_lines', firmId, [r.id]),
    creditNotesOf(db, firmId, r),
  ]);
  return { ...invoiceSummary(r), lines: lines.get(r.id) ?? [], creditNotes };
}
