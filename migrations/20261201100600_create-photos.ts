import type { Knex } from 'knex';

// An uploaded image in object storage. The key is made by the server and starts with the firm.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('photos', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('item_id').unsigned().nullable().references('kit_items.id');
    t.string('object_key', 200).notNullable().unique();
    t.string('content_type', 40).notNullable();
    t.integer('byte_size').unsigned().notNullable();
    t.string('caption', 200).nullable();
    t.integer('uploaded_by_user_id').unsigned().notNullable().references('users.id');
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['firm_id', 'item_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('photos');
}
