import type { Knex } from 'knex';

// What the engineer recommends to the customer, given at completion and printed in the customer's
// report's result box.
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('jobs', 'recommendation')) return;
  await knex.schema.alterTable('jobs', (t) => {
    t.string('recommendation', 500).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('jobs', (t) => {
    t.dropColumn('recommendation');
  });
}
