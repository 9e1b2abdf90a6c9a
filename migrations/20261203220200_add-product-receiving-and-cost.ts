import type { Knex } from 'knex';

// A product's minimum remaining life at receiving (days; 90 unless set), its supplier's code and its
// cost price in whole pence, for the receiving check and the reorder list. One ALTER of one table.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('products', (t) => {
    t.smallint('min_shelf_life_days').unsigned().notNullable().defaultTo(90);
    t.string('supplier_code', 60).nullable();
    t.integer('cost_price_pence').unsigned().nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('products', (t) => {
    t.dropColumn('min_shelf_life_days');
    t.dropColumn('supplier_code');
    t.dropColumn('cost_price_pence');
  });
}
