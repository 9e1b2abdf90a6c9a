import type { Knex } from 'knex';

// The order a site's radiators are flushed in (the furthest from the rig first), set once by the
// engineer and kept for the next visit: a JSON list of the radiators' rooms, in order.
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('sites', 'flush_order')) return;
  await knex.schema.alterTable('sites', (t) => {
    t.json('flush_order').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('sites', (t) => {
    t.dropColumn('flush_order');
  });
}
