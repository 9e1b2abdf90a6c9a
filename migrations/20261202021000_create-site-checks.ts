import type { Knex } from 'knex';

// An inhibitor check visit at a site after its clean. The product's target range is copied onto the row,
// so a later change to the product does not rewrite what the check found.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('site_checks', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('site_id').unsigned().notNullable().references('sites.id');
    t.date('checked_on').notNullable();
    t.integer('product_id').unsigned().notNullable().references('products.id');
    t.decimal('reading', 10, 3).notNullable();
    t.decimal('target_min', 10, 3).notNullable();
    t.decimal('target_max', 10, 3).notNullable();
    t.string('target_unit', 20).nullable();
    t.decimal('tds_ppm', 7, 1).nullable();
    t.enum('result', ['pass', 'fail']).notNullable();
    t.string('notes', 1000).nullable();
    t.integer('by_user_id').unsigned().notNullable().references('users.id');
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['firm_id', 'site_id', 'checked_on']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('site_checks');
}
