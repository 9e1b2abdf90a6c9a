import type { Knex } from 'knex';

// A cleaner's minimum hot circulation time from its label, which the job sheet times against.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('products', (t) => {
    t.smallint('min_circulation_minutes').unsigned().nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('products', (t) => {
    t.dropColumn('min_circulation_minutes');
  });
}
