import type { Knex } from 'knex';

/** Issued invoices with money owed whose due date is on or before `dueBy`. */
export async function listOverdueInvoices(trx: Knex.Transaction, firmId: number, dueBy: string) {
  return (await trx('invoices')
    .where({ firm_id: firmId })
    .whereIn('status', ['issued', 'part_paid'])
    .andWhere('due_on', '<=', dueBy)
    .andWhereRaw('total_pence - credited_pence - paid_pence > 0')
    .orderBy('number')
    .select(
      'id',
      'number',
      'due_on',
      'customer_name',
      'customer_email',
      'total_pence',
      'credited_pence',
      'paid_pence',
    )) as {
    id: number;
    number: number;
    due_on: string;
    customer_name: string;
    customer_email: string | null;
    total_pence: number;
    credited_pence: number;
    paid_pence: number;
  }[];
}
