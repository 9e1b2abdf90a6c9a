import type { Knex } from 'knex';

// A use of a kit item on a completed job: kit marked as used on the job counts as one use of each
// item for its inspection rule, beside the check-ins (DEVELOPERS.md, Product rules: inspection due).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('kit_item_uses', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('item_id').unsigned().notNullable().references('kit_items.id');
    t.integer('job_id').unsigned().notNullable().references('jobs.id').onDelete('CASCADE');
    t.timestamp('used_at', { precision: 3 }).notNullable();
    t.unique(['firm_id', 'item_id', 'job_id']);
    t.index(['firm_id', 'item_id', 'used_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('kit_item_uses');
}
