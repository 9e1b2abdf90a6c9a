import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('product_batches', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('product_id').unsigned().notNullable().references('products.id');
    t.string('lot_number', 60).notNullable();
    t.date('expires_on').notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['firm_id', 'product_id', 'lot_number']);
    t.index(['firm_id', 'expires_on']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('product_batches');
}
