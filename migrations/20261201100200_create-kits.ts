import type { Knex } from 'knex';

// A kit is a named set that travels together. Its whereabouts come from the custody log.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('kits', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.string('name', 80).notNullable();
    t.string('notes', 1000).nullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['firm_id', 'name']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('kits');
}
