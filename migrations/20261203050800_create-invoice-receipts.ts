import type { Knex } from 'knex';

// Money applied to an invoice (recordInvoicePayment): a payment positive, a refund negative, each under
// its payment reference once (unique per firm), so an event delivered twice is applied once.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('invoice_receipts', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('invoice_id').unsigned().notNullable().references('invoices.id');
    t.string('payment_ref', 255).notNullable();
    t.integer('amount_pence').notNullable();
    t.timestamp('received_at', { precision: 3 }).notNullable();
    t.unique(['firm_id', 'payment_ref']);
    t.index(['firm_id', 'received_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('invoice_receipts');
}
