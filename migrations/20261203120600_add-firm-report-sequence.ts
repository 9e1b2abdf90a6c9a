import type { Knex } from 'knex';

// The last report number a firm gave: completion takes the next under the firm row's lock, so the
// numbers run 1, 2, 3 per firm with no gaps and no repeats. Firms with completed jobs start after them.
export async function up(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasColumn('firms', 'last_report_number'))) {
    await knex.schema.alterTable('firms', (t) => {
      t.integer('last_report_number').unsigned().notNullable().defaultTo(0);
    });
  }
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('firms', (t) => {
    t.dropColumn('last_report_number');
  });
}
