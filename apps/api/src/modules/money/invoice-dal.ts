import type { Knex } from 'knex';
import type { InvoiceState } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

export interface InvoiceRow {
  id: number;
  firm_id: number;
  job_id: number | null;
  quote_id: number | null;
  customer_id: number;
  number: number | null;
  status: InvoiceState;
  supplied_at: Date | null;
  issued_at: Date | null;
  issued_on: string | null;
  due_on: string | null;
  firm_name: string;
  firm_address: string | null;
  vat_number: string | null;
  vat_registered: number | boolean;
  customer_name: string;
  customer_address: string;
  customer_email: string | null;
  net_pence: number;
  vat_pence: number;
  total_pence: number;
  paid_pence: number;
  credited_pence: number;
  created_at: Date;
}

export type NewInvoice = Omit<InvoiceRow, 'id' | 'created_at' | 'paid_pence' | 'credited_pence'> & {
  created_by_user_id: number | null;
};

export async function insertInvoice(trx: Knex.Transaction, row: NewInvoice): Promise<number> {
  const [id] = await trx('invoices').insert(row);
  return id as number;
}

export async function findInvoice(
  db: Db,
  firmId: number,
  id: number,
  opts: { forUpdate?: boolean } = {},
): Promise<InvoiceRow | undefined> {
  const q = db('invoices').where({ firm_id: firmId, id }).first();
  return (await (opts.forUpdate ? q.forUpdate() : q)) as InvoiceRow | undefined;
}

export async function findInvoiceForJob(db: Db, firmId: number, jobId: number): Promise<InvoiceRow | undefined> {
  return (await db('invoices').where({ firm_id: firmId, job_id: jobId }).first()) as InvoiceRow | undefined;
}

export async function listInvoices(
  db: Db,
  firmId: number,
  filter: { status?: InvoiceState; jobId?: number } = {},
): Promise<InvoiceRow[]> {
  const q = db('invoices').where({ firm_id: firmId });
  if (filter.status) q.andWhere({ status: filter.status });
  if (filter.jobId) q.andWhere({ job_id: filter.jobId });
  return (await q
    .orderBy([
      { column: 'number', order: 'desc' },
      { column: 'id', order: 'desc' },
    ])
    .limit(500)) as InvoiceRow[];
}

export async function updateDraftInvoice(
  trx: Knex.Transaction,
  firmId: number,
  id: number,
  fields: Partial<Pick<InvoiceRow, 'net_pence' | 'vat_pence' | 'total_pence'>>,
): Promise<void> {
  await trx('invoices').where({ firm_id: firmId, id, status: 'draft' }).update(fields);
}

export async function markInvoiceIssued(
  trx: Knex.Transaction,
  firmId: number,
  id: number,
  fields: Pick<
    InvoiceRow,
    'number' | 'supplied_at' | 'issued_at' | 'issued_on' | 'due_on' | 'firm_name' | 'firm_address' | 'vat_number'
  > & { customer_name: string; customer_address: string; customer_email: string | null; vat_registered: boolean },
): Promise<void> {
  await trx('invoices')
    .where({ firm_id: firmId, id, status: 'draft' })
    .update({ ...fields, status: 'issued' });
}

/** The money columns and the state that follows from them (the caller holds the row's lock). */
export async function setInvoiceMoney(
  trx: Knex.Transaction,
  firmId: number,
  id: number,
  fields: { paid_pence: number; credited_pence: number; status: InvoiceState },
): Promise<void> {
  await trx('invoices').where({ firm_id: firmId, id }).update(fields);
}

/** A payment (positive) or refund (negative) once per reference: false when the reference was applied before. */
export async function insertReceiptOnce(
  trx: Knex.Transaction,
  row: { firm_id: number; invoice_id: number; payment_ref: string; amount_pence: number; received_at: Date },
): Promise<boolean> {
  const [inserted] = (await trx.raw(
    'INSERT IGNORE INTO invoice_receipts (firm_id, invoice_id, payment_ref, amount_pence, received_at) VALUES (?, ?, ?, ?, ?)',
    [row.firm_id, row.invoice_id, row.payment_ref, row.amount_pence, row.received_at],
  )) as [{ affectedRows: number }];
  return inserted.affectedRows === 1;
}

export async function insertPayToken(
  trx: Knex.Transaction,
  row: { firm_id: number; invoice_id: number; token_hash: string; expires_at: Date },
): Promise<void> {
  await trx('invoice_pay_tokens').insert(row);
}

/** The invoice a pay link opens (any firm: the token is the key), if the link has not expired. */
export async function findPayToken(
  db: Db,
  tokenHash: string,
  now: Date,
): Promise<{ firmId: number; invoiceId: number } | undefined> {
  const r = (await db('invoice_pay_tokens')
    .where({ token_hash: tokenHash })
    .andWhere('expires_at', '>', now)
    .first('firm_id', 'invoice_id')) as { firm_id: number; invoice_id: number } | undefined;
  return r && { firmId: Number(r.firm_id), invoiceId: Number(r.invoice_id) };
}
