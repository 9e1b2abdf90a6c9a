import type { Knex } from 'knex';

// A VAT invoice (Value Added Tax Regulations 1995, regulation 14). The firm's and the customer's names,
// addresses and the VAT number are copied on issue, so an issued invoice never changes when a setting
// does. status follows from the money (domain invoiceStateAfterPayments); paid_pence is payments less
// refunds (invoice_receipts), credited_pence the credit notes' totals.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('invoices', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('job_id').unsigned().nullable().references('jobs.id');
    t.integer('quote_id').unsigned().nullable().references('quotes.id');
    t.integer('customer_id').unsigned().notNullable().references('customers.id');
    t.integer('number').unsigned().nullable();
    t.enum('status', ['draft', 'issued', 'part_paid', 'paid', 'credited']).notNullable().defaultTo('draft');
    t.timestamp('supplied_at', { precision: 3 }).nullable();
    t.timestamp('issued_at', { precision: 3 }).nullable();
    t.date('issued_on').nullable();
    t.date('due_on').nullable();
    t.string('firm_name', 120).notNullable();
    t.string('firm_address', 500).nullable();
    t.string('vat_number', 20).nullable();
    t.boolean('vat_registered').notNullable();
    t.string('customer_name', 120).notNullable();
    t.string('customer_address', 600).notNullable();
    t.string('customer_email', 254).nullable();
    t.integer('net_pence').notNullable();
    t.integer('vat_pence').notNullable();
    t.integer('total_pence').notNullable();
    t.integer('paid_pence').notNullable().defaultTo(0);
    t.integer('credited_pence').notNullable().defaultTo(0);
    t.integer('created_by_user_id').unsigned().nullable().references('users.id');
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['firm_id', 'number']);
    t.unique(['firm_id', 'job_id']);
    t.index(['firm_id', 'status', 'issued_on']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('invoices');
}
