import type { Knex } from 'knex';

// The check-in's "cleaned" tick, kept on the custody event of each item it was ticked for.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('custody_events', (t) => {
    t.boolean('cleaned').notNullable().defaultTo(false);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('custody_events', (t) => {
    t.dropColumn('cleaned');
  });
}
