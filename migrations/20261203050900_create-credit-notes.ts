import type { Knex } from 'knex';

// A credit note: the only way to correct an issued invoice. Its own gap-free number per firm.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('credit_notes', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('invoice_id').unsigned().notNullable().references('invoices.id');
    t.integer('number').unsigned().notNullable();
    t.string('reason', 300).notNullable();
    t.timestamp('issued_at', { precision: 3 }).notNullable();
    t.integer('net_pence').notNullable();
    t.integer('vat_pence').notNullable();
    t.integer('total_pence').notNullable();
    t.integer('created_by_user_id').unsigned().nullable().references('users.id');
    t.unique(['firm_id', 'number']);
    t.index(['firm_id', 'invoice_id']);
    t.index(['firm_id', 'issued_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('credit_notes');
}
