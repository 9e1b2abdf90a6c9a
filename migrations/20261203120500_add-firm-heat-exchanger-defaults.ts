import type { Knex } from 'knex';

// A firm's heat exchanger content by fuel and boiler kind (the domain's heatExchangerDefaultsSchema);
// null while the firm uses the built-in defaults.
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('firms', 'heat_exchanger_defaults')) return;
  await knex.schema.alterTable('firms', (t) => {
    t.json('heat_exchanger_defaults').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('firms', (t) => {
    t.dropColumn('heat_exchanger_defaults');
  });
}
