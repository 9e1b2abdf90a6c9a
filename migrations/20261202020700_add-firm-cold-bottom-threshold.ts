import type { Knex } from 'knex';

// The top-to-bottom difference over which a radiator is flagged with a cold bottom: a firm
// setting, 10 K by default (common practice, no source).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('firms', (t) => {
    t.decimal('cold_bottom_threshold_k', 4, 1).notNullable().defaultTo(10);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('firms', (t) => {
    t.dropColumn('cold_bottom_threshold_k');
  });
}
