import type { Knex } from 'knex';

type Db = Knex | Knex.Transaction;

/** Open invoices' money, summed in SQL by age since the invoice date (0-30, 31-60, over 60 days). */
export async function agedDebt(db: Db, firmId: number, today: string) {
  const owed = 'GREATEST(total_pence - credited_pence - paid_pence, 0)';
  const r = (await db('invoices')
    .where({ firm_id: firmId })
    .whereIn('status', ['issued', 'part_paid'])
    .first(
      db.raw(`COALESCE(SUM(${owed}), 0) AS owed`),
      db.raw(`COALESCE(SUM(CASE WHEN DATEDIFF(?, issued_on) <= 30 THEN ${owed} ELSE 0 END), 0) AS d30`, [today]),
      db.raw(`COALESCE(SUM(CASE WHEN DATEDIFF(?, issued_on) BETWEEN 31 AND 60 THEN ${owed} ELSE 0 END), 0) AS d60`, [
        today,
      ]),
      db.raw(`COALESCE(SUM(CASE WHEN DATEDIFF(?, issued_on) > 60 THEN ${owed} ELSE 0 END), 0) AS d61`, [today]),
      db.raw(`COALESCE(SUM(CASE WHEN due_on < ? AND ${owed} > 0 THEN 1 ELSE 0 END), 0) AS overdue`, [today]),
    )) as Record<string, string | number>;
  return {
    owedPence: Number(r.owed),
    aged: { days_0_30: Number(r.d30), days_31_60: Number(r.d60), days_over_60: Number(r.d61) },
    overdueCount: Number(r.overdue),
  };
}

/** Invoiced per month by the invoice date (a firm-zone day), net and gross, from `fromDay` on. */
export async function invoicedByMonth(db: Db, firmId: number, fromDay: string) {
  return (await db('invoices')
    .where({ firm_id: firmId })
    .whereNot('status', 'draft')
    .andWhere('issued_on', '>=', fromDay)
    .groupByRaw("DATE_FORMAT(issued_on, '%Y-%m')")
    .select(
      db.raw("DATE_FORMAT(issued_on, '%Y-%m') AS month"),
      db.raw('SUM(net_pence) AS net'),
      db.raw('SUM(total_pence) AS total'),
    )) as { month: string; net: string | number; total: string | number }[];
}

export async function creditNotesBetween(db: Db, firmId: number, from: Date, to: Date) {
  return (await db('credit_notes as n')
    .join('invoices as i', (j) => j.on('i.id', '=', 'n.invoice_id').andOn('i.firm_id', '=', 'n.firm_id'))
    .where('n.firm_id', firmId)
    .andWhere('n.issued_at', '>=', from)
    .andWhere('n.issued_at', '<', to)
    .orderBy('n.number')
    .select(
      'n.number',
      'n.issued_at',
      'n.reason',
      'n.net_pence',
      'n.vat_pence',
      'n.total_pence',
      'i.number as invoice_number',
      'i.customer_name',
    )) as {
    number: number;
    issued_at: Date;
    reason: string;
    net_pence: number;
    vat_pence: number;
    total_pence: number;
    invoice_number: number | null;
    customer_name: string;
  }[];
}

export async function invoicesIssuedBetween(db: Db, firmId: number, fromDay: string, toDay: string) {
  return (await db('invoices')
    .where({ firm_id: firmId })
    .whereNot('status', 'draft')
    .andWhere('issued_on', '>=', fromDay)
    .andWhere('issued_on', '<=', toDay)
    .orderBy('number')
    .select(
      'number',
      'issued_on',
      'supplied_at',
      'customer_name',
      'vat_number',
      'net_pence',
      'vat_pence',
      'total_pence',
      'status',
      'job_id',
    )) as {
    number: number;
    issued_on: string;
    supplied_at: Date | null;
    customer_name: string;
    vat_number: string | null;
    net_pence: number;
    vat_pence: number;
    total_pence: number;
    status: string;
    job_id: number | null;
  }[];
}

export async function receiptsBetween(db: Db, firmId: number, from: Date, to: Date) {
  return (await db('invoice_receipts as r')
    .join('invoices as i', (j) => j.on('i.id', '=', 'r.invoice_id').andOn('i.firm_id', '=', 'r.firm_id'))
    .where('r.firm_id', firmId)
    .andWhere('r.received_at', '>=', from)
    .andWhere('r.received_at', '<', to)
    .orderBy('r.received_at')
    .select('r.payment_ref', 'r.amount_pence', 'r.received_at', 'i.number as invoice_number', 'i.customer_name')) as {
    payment_ref: string;
    amount_pence: number;
    received_at: Date;
    invoice_number: number | null;
    customer_name: string;
  }[];
}
