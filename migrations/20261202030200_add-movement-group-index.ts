import type { Knex } from 'knex';

// Every stock-changing route re-reads the movements of the group it has just written (and a reversal reads
// a transfer's legs by group): without this index that read scanned the firm's whole ledger on every write.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('stock_movements', (t) => {
    t.index(['firm_id', 'group_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('stock_movements', (t) => {
    t.dropIndex(['firm_id', 'group_id']);
  });
}
