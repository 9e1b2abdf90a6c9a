import type { Knex } from 'knex';

// The running quantity per place and batch, changed only in the same transaction as a movement.
// The CHECK is the backstop: the conditional update refuses first, with a message.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('stock_balances', (t) => {
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('location_id').unsigned().notNullable().references('locations.id');
    t.integer('batch_id').unsigned().notNullable().references('product_batches.id');
    t.integer('product_id').unsigned().notNullable().references('products.id');
    t.integer('quantity').notNullable().defaultTo(0);
    t.primary(['firm_id', 'location_id', 'batch_id']);
    t.index(['firm_id', 'product_id', 'location_id']);
  });
  await knex.raw('ALTER TABLE stock_balances ADD CONSTRAINT stock_balances_not_negative CHECK (quantity >= 0)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('stock_balances');
}
