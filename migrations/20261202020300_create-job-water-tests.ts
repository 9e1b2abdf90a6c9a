import type { Knex } from 'knex';

// The water tests of a visit, one row per job: TDS after the final flush, the inhibitor reading
// after dosing (in the inhibitor product's own target unit), pH where taken.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('job_water_tests', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('job_id').unsigned().notNullable().references('jobs.id').onDelete('CASCADE');
    t.decimal('mains_tds_ppm', 6, 1).nullable();
    t.decimal('system_tds_ppm', 6, 1).nullable();
    t.boolean('water_clear').nullable();
    t.decimal('inhibitor_reading', 9, 3).nullable();
    t.integer('inhibitor_product_id').unsigned().nullable().references('products.id');
    t.decimal('ph', 4, 2).nullable();
    t.integer('recorded_by_user_id').unsigned().notNullable().references('users.id');
    t.timestamp('recorded_at', { precision: 3 }).notNullable();
    t.unique(['firm_id', 'job_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('job_water_tests');
}
