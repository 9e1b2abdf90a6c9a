import type { Knex } from 'knex';

// Chemical products. Pack size is kept in millilitres so 500 ml and 1 L packs compare exactly;
// stock is counted in whole packs.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('products', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.string('name', 120).notNullable();
    t.string('kind', 40).notNullable();
    t.integer('pack_size_ml').unsigned().notNullable();
    t.decimal('dose_litres_per_100l', 6, 3).nullable();
    t.smallint('radiators_per_pack').unsigned().nullable();
    t.decimal('target_min', 10, 3).nullable();
    t.decimal('target_max', 10, 3).nullable();
    t.string('target_unit', 20).nullable();
    t.string('test_method', 300).nullable();
    t.smallint('shelf_life_months').unsigned().nullable();
    t.string('hazard_notes', 2000).nullable();
    t.string('sds_object_key', 200).nullable();
    t.integer('sds_byte_size').unsigned().nullable();
    t.timestamp('sds_uploaded_at', { precision: 3 }).nullable();
    t.boolean('active').notNullable().defaultTo(true);
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['firm_id', 'name']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('products');
}
