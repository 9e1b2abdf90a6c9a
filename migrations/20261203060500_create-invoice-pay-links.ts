import type { Knex } from 'knex';

// The customer's pay link for an invoice (/pay/<token>): only the token's SHA-256 is kept, as for invitations.
// No sign-in; the token does one thing (start a checkout for what is still owed) and stops working once paid.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('invoice_pay_links', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('invoice_id').unsigned().notNullable();
    t.string('token_hash', 64).notNullable();
    t.timestamp('expires_at', { precision: 3 }).notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['token_hash']);
    t.index(['firm_id', 'invoice_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('invoice_pay_links');
}
