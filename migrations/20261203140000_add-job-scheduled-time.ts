import type { Knex } from 'knex';

// The time of day a visit is booked for ('HH:MM' in the firm's zone), beside its date; optional.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('jobs', (t) => {
    t.string('scheduled_time', 5).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('jobs', (t) => {
    t.dropColumn('scheduled_time');
  });
}
