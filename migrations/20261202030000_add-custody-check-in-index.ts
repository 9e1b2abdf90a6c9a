import type { Knex } from 'knex';

// Each kit item's uses since its last inspection count its check-ins after a moment: with the action and
// the time in the index that count reads the index alone (the kits list does it for every item).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('custody_events', (t) => {
    t.index(['firm_id', 'item_id', 'action', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('custody_events', (t) => {
    t.dropIndex(['firm_id', 'item_id', 'action', 'created_at']);
  });
}
