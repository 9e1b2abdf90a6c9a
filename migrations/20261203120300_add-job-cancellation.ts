import type { Knex } from 'knex';

// Who cancelled a booked job, when, and why.
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('jobs', 'cancelled_at')) return;
  await knex.schema.alterTable('jobs', (t) => {
    t.timestamp('cancelled_at', { precision: 3 }).nullable();
    t.integer('cancelled_by_user_id').unsigned().nullable().references('users.id');
    t.string('cancellation_reason', 500).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('jobs', (t) => {
    t.dropForeign(['cancelled_by_user_id']);
    t.dropColumn('cancelled_at');
    t.dropColumn('cancelled_by_user_id');
    t.dropColumn('cancellation_reason');
  });
}
