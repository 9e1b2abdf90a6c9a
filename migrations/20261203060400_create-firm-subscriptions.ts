import type { Knex } from 'knex';

// The firm's own subscription to Heatfleet (per active van, monthly) as the payment service last told us.
// payment_failed_at is the first failed payment of the current unpaid run: the firm turns read-only 14 days
// after it (README, Payments) and it is cleared the moment an invoice is paid.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('firm_subscriptions', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.string('customer_id', 255).notNullable();
    t.string('subscription_id', 255).notNullable();
    t.string('item_id', 255).notNullable();
    t.string('status', 30).notNullable();
    t.integer('quantity').unsigned().notNullable();
    t.integer('unit_amount_pence').unsigned().notNullable();
    t.timestamp('trial_ends_at', { precision: 3 }).nullable();
    t.timestamp('period_ends_at', { precision: 3 }).nullable();
    t.timestamp('payment_failed_at', { precision: 3 }).nullable();
    t.string('card_brand', 30).nullable();
    t.string('card_last4', 4).nullable();
    t.tinyint('card_exp_month').unsigned().nullable();
    t.smallint('card_exp_year').unsigned().nullable();
    t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['firm_id']);
    t.unique(['subscription_id']);
    t.unique(['customer_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('firm_subscriptions');
}
