import type { Knex } from 'knex';

// The payment service's webhook events already applied, by their own id: a repeated or late event is
// acknowledged and changes nothing (the row is written in the same transaction as the change it made).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('payment_events', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.string('event_id', 255).notNullable();
    t.string('type', 100).notNullable();
    t.timestamp('received_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['event_id']);
    t.index(['firm_id', 'received_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('payment_events');
}
