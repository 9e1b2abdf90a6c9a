import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('firms', (t) => {
    t.increments('id').primary();
    t.string('name', 120).notNullable();
    t.string('time_zone', 64).notNullable().defaultTo('Europe/London');
    t.enum('volume_unit', ['litres', 'imperial_gallons']).notNullable().defaultTo('litres');
    t.string('address', 500).nullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('firms');
}
