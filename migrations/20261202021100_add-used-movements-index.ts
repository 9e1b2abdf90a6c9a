import type { Knex } from 'knex';

// The overview's chemical-used-per-month reads a year of 'used' rows per firm: with product and quantity
// in the index it never touches the ledger's rows, so it stays quick at a million movements.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('stock_movements', (t) => {
    t.index(['firm_id', 'kind', 'created_at', 'product_id', 'quantity_delta'], 'stock_movements_usage_by_month');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('stock_movements', (t) => {
    t.dropIndex(['firm_id', 'kind', 'created_at', 'product_id', 'quantity_delta'], 'stock_movements_usage_by_month');
  });
}
