import type { Knex } from 'knex';

// Photos taken on a job (filter magnets, the system, test results), tagged by what they show.
// Safe to run again after a half-finished attempt: MariaDB commits DDL implicitly.
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('photos', 'job_id')) return;
  await knex.schema.alterTable('photos', (t) => {
    t.integer('job_id').unsigned().nullable().references('jobs.id').after('item_id');
    t.string('tag', 20).nullable().after('job_id');
    t.index(['firm_id', 'job_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('photos', (t) => {
    t.dropForeign(['job_id']);
    t.dropIndex(['firm_id', 'job_id']);
    t.dropColumn('job_id');
    t.dropColumn('tag');
  });
}
