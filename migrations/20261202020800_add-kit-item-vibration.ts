import type { Knex } from 'knex';

// A vibrating tool's magnitude (m/s^2, from its maker or the firm's own measurement), for the
// hand-arm vibration points of agitation.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('kit_items', (t) => {
    t.decimal('vibration_ms2', 5, 2).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('kit_items', (t) => {
    t.dropColumn('vibration_ms2');
  });
}
