import type { Knex } from 'knex';

// The kit used on a visit, chosen from what the job's van held at the time.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('job_kit_items', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('job_id').unsigned().notNullable().references('jobs.id').onDelete('CASCADE');
    t.integer('kit_item_id').unsigned().notNullable().references('kit_items.id');
    t.unique(['firm_id', 'job_id', 'kit_item_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('job_kit_items');
}
