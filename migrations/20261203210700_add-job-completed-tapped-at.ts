import type { Knex } from 'knex';

// When the engineer tapped "Complete" (X-Tapped-At), beside completed_at (when the server completed it): a
// completion queued on a phone without signal arrives later than it was done.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('jobs', (t) => {
    t.timestamp('completed_tapped_at', { precision: 3 }).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('jobs', (t) => {
    t.dropColumn('completed_tapped_at');
  });
}
