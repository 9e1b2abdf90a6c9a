import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('reminder_settings', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().unique().references('firms.id').onDelete('CASCADE');
    t.tinyint('scan_hour').unsigned().notNullable().defaultTo(7);
    t.boolean('inspection_reminders').notNullable().defaultTo(true);
    t.boolean('van_reminders').notNullable().defaultTo(true);
    t.date('last_scan_on').nullable();
    t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('reminder_settings');
}
