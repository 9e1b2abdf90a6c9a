import type { Knex } from 'knex';

// A visit is a full clean or an inhibitor-only visit; every job booked before this was a full clean.
// Safe to run again after a half-finished attempt: MariaDB commits DDL implicitly.
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('jobs', 'visit_kind')) return;
  await knex.schema.alterTable('jobs', (t) => {
    t.enum('visit_kind', ['full_clean', 'inhibitor_only']).notNullable().defaultTo('full_clean').after('status');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('jobs', (t) => {
    t.dropColumn('visit_kind');
  });
}
