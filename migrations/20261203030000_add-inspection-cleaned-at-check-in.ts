import type { Knex } from 'knex';

// An inspection written by the "cleaned" tick of a check-in (a magnet set cleaned after each job), told
// apart from one recorded on its own.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('inspections', (t) => {
    t.boolean('cleaned_at_check_in').notNullable().defaultTo(false);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('inspections', (t) => {
    t.dropColumn('cleaned_at_check_in');
  });
}
