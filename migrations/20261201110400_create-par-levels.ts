import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('par_levels', (t) => {
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('location_id').unsigned().notNullable().references('locations.id');
    t.integer('product_id').unsigned().notNullable().references('products.id');
    t.integer('minimum').unsigned().notNullable();
    t.integer('target').unsigned().notNullable();
    t.primary(['firm_id', 'location_id', 'product_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('par_levels');
}
