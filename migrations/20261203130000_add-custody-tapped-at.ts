import type { Knex } from 'knex';

// When the engineer tapped (the X-Tapped-At header), beside created_at (when it reached the server): a
// check-out made without signal arrives later than it happened. Null for events sent without the header.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('custody_events', (t) => {
    t.timestamp('tapped_at', { precision: 3 }).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('custody_events', (t) => {
    t.dropColumn('tapped_at');
  });
}
