import type { Knex } from 'knex';

// The firm's price list: visits (base + rate per radiator, or radiator bands), chemicals at a sell
// price (tied to a product) and extras. Whole pence in integer columns.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('price_items', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.enum('kind', ['visit', 'chemical', 'extra']).notNullable();
    t.string('name', 120).notNullable();
    t.enum('visit_kind', ['full_clean', 'inhibitor_only', 'annual_check']).nullable();
    t.enum('pricing', ['per_radiator', 'bands']).nullable();
    t.integer('base_pence').unsigned().notNullable().defaultTo(0);
    t.integer('per_radiator_pence').unsigned().notNullable().defaultTo(0);
    t.json('bands').nullable();
    t.integer('product_id').unsigned().nullable().references('products.id');
    t.integer('unit_pence').unsigned().notNullable().defaultTo(0);
    t.boolean('active').notNullable().defaultTo(true);
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['firm_id', 'kind']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('price_items');
}
