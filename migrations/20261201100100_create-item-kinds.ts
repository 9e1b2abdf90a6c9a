import type { Knex } from 'knex';

// What a kit item is, and its inspection rule: every N days and/or after N uses.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('item_kinds', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.string('name', 80).notNullable();
    t.smallint('interval_days').unsigned().nullable();
    t.smallint('interval_uses').unsigned().nullable();
    t.smallint('due_soon_days').unsigned().notNullable().defaultTo(7);
    t.enum('overdue_policy', ['allow_with_reason', 'block']).notNullable().defaultTo('allow_with_reason');
    t.boolean('electrical').notNullable().defaultTo(false);
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['firm_id', 'name']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('item_kinds');
}
