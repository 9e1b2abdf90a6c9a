import type { Knex } from 'knex';

// When the engineer tapped (the X-Tapped-At header) for stock used by hand, beside created_at (when it reached
// the server). A nullable column at the end: MariaDB adds it in place, without copying the ledger.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('stock_movements', (t) => {
    t.timestamp('tapped_at', { precision: 3 }).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('stock_movements', (t) => {
    t.dropColumn('tapped_at');
  });
}
