import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sites', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('customer_id').unsigned().notNullable().references('customers.id');
    t.string('address', 500).notNullable();
    t.string('postcode', 12).nullable();
    t.string('access_notes', 1000).nullable();
    t.string('system_notes', 1000).nullable();
    t.date('next_check_on').nullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['firm_id', 'customer_id']);
    t.index(['firm_id', 'next_check_on']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sites');
}
