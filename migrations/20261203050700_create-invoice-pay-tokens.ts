import type { Knex } from 'knex';

// Links to pay an invoice (/pay/<token>): one per e-mail or QR code shown, only the SHA-256 kept,
// each with its expiry. The pay page itself belongs to the payments module.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('invoice_pay_tokens', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('invoice_id').unsigned().notNullable().references('invoices.id').onDelete('CASCADE');
    t.string('token_hash', 64).notNullable().unique();
    t.timestamp('expires_at', { precision: 3 }).notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['firm_id', 'invoice_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('invoice_pay_tokens');
}
