import type { Knex } from 'knex';

// A firm's own kind of product, named when the kind is "other".
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('products', (t) => {
    t.string('own_kind', 40).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('products', (t) => {
    t.dropColumn('own_kind');
  });
}
