import type { Knex } from 'knex';

// Each firm's own account with the payment service (a connected account: customers' money lands there, not with
// Heatfleet), and whether the service lets it take card payments yet.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('payment_accounts', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.string('provider_account_id', 64).notNullable();
    t.boolean('charges_enabled').notNullable().defaultTo(false);
    t.boolean('details_submitted').notNullable().defaultTo(false);
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['firm_id']);
    t.unique(['provider_account_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('payment_accounts');
}
