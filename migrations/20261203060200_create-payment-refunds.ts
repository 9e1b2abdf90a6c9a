import type { Knex } from 'knex';

// A refund an owner or admin asked for, as the payment service recorded it (its own id, so a retry never
// records it twice).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('payment_refunds', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('payment_id').unsigned().notNullable().references('payments.id').onDelete('CASCADE');
    t.string('provider_refund_id', 255).notNullable();
    t.integer('amount_pence').unsigned().notNullable();
    t.string('reason', 200).nullable();
    t.integer('created_by_user_id').unsigned().nullable().references('users.id');
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['provider_refund_id']);
    t.index(['firm_id', 'payment_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('payment_refunds');
}
