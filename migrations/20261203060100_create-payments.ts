import type { Knex } from 'knex';

// One attempt to pay an invoice through the payment service's hosted checkout: made pending when the checkout
// session is made, then succeeded, failed or expired as its webhooks arrive. refunded_pence is the charge's own
// running total from the service, so a late or repeated refund event sets it rather than adding to it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('payments', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('invoice_id').unsigned().notNullable();
    t.string('checkout_session_id', 255).notNullable();
    t.string('payment_intent_id', 255).nullable();
    t.integer('amount_pence').unsigned().notNullable();
    t.integer('refunded_pence').unsigned().notNullable().defaultTo(0);
    t.enum('status', ['pending', 'succeeded', 'failed', 'expired']).notNullable().defaultTo('pending');
    t.string('failure_message', 255).nullable();
    t.enum('started_from', ['email_link', 'doorstep']).notNullable();
    t.timestamp('paid_at', { precision: 3 }).nullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['checkout_session_id']);
    t.unique(['payment_intent_id']);
    t.index(['firm_id', 'invoice_id']);
    t.index(['firm_id', 'paid_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('payments');
}
