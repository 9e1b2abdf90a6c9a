import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('inspections', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('item_id').unsigned().notNullable().references('kit_items.id');
    t.enum('result', ['passed', 'failed']).notNullable();
    t.string('notes', 1000).nullable();
    t.integer('photo_id').unsigned().nullable();
    t.integer('by_user_id').unsigned().notNullable().references('users.id');
    t.date('inspected_on').notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['firm_id', 'item_id', 'inspected_on']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('inspections');
}
