import type { Knex } from 'knex';

// The lots held somewhere, by lot: the overview's and the reminders' expiring lots read the places holding each of
// a few hundred lots. Through the foreign key's index on batch_id MariaDB read every place's row of each lot, most of
// them used up (0 packs): on the bench's large firm 23,114 rows read for 116 kept, 27 ms; through this index, with
// the packs in it, only the rows holding packs, 2.5 ms (README, Performance).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('stock_balances', (t) => {
    t.index(['firm_id', 'batch_id', 'quantity'], 'stock_balances_firm_batch_quantity');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('stock_balances', (t) => {
    t.dropIndex(['firm_id', 'batch_id', 'quantity'], 'stock_balances_firm_batch_quantity');
  });
}
