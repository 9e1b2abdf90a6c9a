import type { Knex } from 'knex';

// When the engineer tapped (X-Tapped-At) beside when it reached the server: a job-sheet write kept on a phone
// without signal arrives later than it was done. Null for writes sent without the header.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('photos', (t) => {
    t.timestamp('tapped_at', { precision: 3 }).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('photos', (t) => {
    t.dropColumn('tapped_at');
  });
}
