import type { Knex } from 'knex';

type Db = Knex | Knex.Transaction;

export interface CreditNoteRow {
  id: number;
  invoice_id: number;
  number: number;
  reason: string;
  issued_at: Date;
  net_pence: number;
  vat_pence: number;
  total_pence: number;
}

export async function insertCreditNote(trx: Knex.Transaction, row: Record<string, unknown>): Promise<number> {
  const [id] = await trx('credit_notes').insert(row);
  return id as number;
}

export async function listCreditNotes(
  db: Db,
  firmId: number,
  filter: { invoiceId?: number },
): Promise<CreditNoteRow[]> {
  const q = db('credit_notes').where({ firm_id: firmId });
  if (filter.invoiceId) q.andWhere({ invoice_id: filter.invoiceId });
  return (await q.orderBy('number')) as CreditNoteRow[];
}

export async function findCreditNote(db: Db, firmId: number, id: number): Promise<CreditNoteRow | undefined> {
  return (await db('credit_notes').where({ firm_id: firmId, id }).first()) as CreditNoteRow | undefined;
}

/** Quantities already credited per invoice line. */
export async function creditedQuantities(db: Db, firmId: number, invoiceId: number): Promise<Map<number, number>> {
  const rows = (await db('credit_note_lines as l')
    .join('credit_notes as n', (j) => j.on('n.id', '=', 'l.credit_note_id').andOn('n.firm_id', '=', 'l.firm_id'))
    .where({ 'l.firm_id': firmId, 'n.invoice_id': invoiceId })
    .whereNotNull('l.invoice_line_id')
    .groupBy('l.invoice_line_id')
    .select('l.invoice_line_id', db.raw('SUM(l.quantity) AS q'))) as { invoice_line_id: number; q: number | string }[];
  return new Map(rows.map((r) => [Number(r.invoice_line_id), Number(r.q)]));
}
