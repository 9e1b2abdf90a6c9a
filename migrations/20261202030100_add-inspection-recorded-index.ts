import type { Knex } from 'knex';

// The moment an item's last inspection was recorded bounds its uses since; this reads it from the index.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('inspections', (t) => {
    t.index(['firm_id', 'item_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('inspections', (t) => {
    t.dropIndex(['firm_id', 'item_id', 'created_at']);
  });
}
