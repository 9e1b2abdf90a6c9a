import type { Knex } from 'knex';

/** A card payment against the seeded invoice, still waiting for the customer (so a refund probe answers 409). */
export async function seedPayment(trx: Knex.Transaction, firmId: number, invoiceId: number): Promise<number> {
  const [id] = (await trx('payments').insert({
    firm_id: firmId,
    invoice_id: invoiceId,
    reference: `seeded-${firmId}-${invoiceId}`,
    checkout_session_id: `cs_test_seeded_${firmId}_${invoiceId}`,
    amount_pence: 1_000,
    status: 'pending',
    started_from: 'email_link',
  })) as number[];
  return id!;
}
