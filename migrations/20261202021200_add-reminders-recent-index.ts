import type { Knex } from 'knex';

// The overview shows a firm's latest reminders: an index led by firm_id keeps that a short read.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('reminders', (t) => {
    t.index(['firm_id', 'created_at'], 'reminders_recent');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('reminders', (t) => {
    t.dropIndex(['firm_id', 'created_at'], 'reminders_recent');
  });
}
