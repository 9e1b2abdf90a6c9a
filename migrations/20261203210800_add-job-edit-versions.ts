import type { Knex } from 'knex';

// The job's fields two people could edit at once (the notes on the sheet, the survey in the booking) carry a
// version: a write names the version it was made on and is refused (409) when another landed since.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('jobs', (t) => {
    t.integer('notes_version').unsigned().notNullable().defaultTo(0);
    t.integer('survey_version').unsigned().notNullable().defaultTo(0);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('jobs', (t) => {
    t.dropColumn('notes_version');
    t.dropColumn('survey_version');
  });
}
