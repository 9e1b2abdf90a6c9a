import type { Knex } from 'knex';

// The append-only ledger: one row per place and batch touched. A transfer is two rows (out and in)
// sharing a group; a correction is a reversal row pointing at the row it undoes.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('stock_movements', (t) => {
    t.bigIncrements('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.string('group_id', 36).notNullable();
    t.enum('kind', [
      'received',
      'transfer_out',
      'transfer_in',
      'used',
      'counted',
      'written_off',
      'reversal',
    ]).notNullable();
    t.integer('location_id').unsigned().notNullable().references('locations.id');
    t.integer('product_id').unsigned().notNullable().references('products.id');
    t.integer('batch_id').unsigned().notNullable().references('product_batches.id');
    t.integer('quantity_delta').notNullable();
    t.string('reason', 300).nullable();
    t.string('reference', 100).nullable();
    t.bigInteger('reverses_movement_id').unsigned().nullable();
    t.integer('job_id').unsigned().nullable();
    t.integer('by_user_id').unsigned().notNullable().references('users.id');
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    // Keyset paging of the ledger, newest first, per firm and by each filter.
    t.index(['firm_id', 'id']);
    t.index(['firm_id', 'location_id', 'id']);
    t.index(['firm_id', 'product_id', 'id']);
    t.index(['firm_id', 'kind', 'created_at']);
    t.unique(['firm_id', 'reverses_movement_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('stock_movements');
}
