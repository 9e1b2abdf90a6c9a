import type { Knex } from 'knex';

// What the report says about the system (boiler make, model and location, magnetic filter, the
// cistern's condition), validated by the domain's systemDetailsSchema; null until someone says.
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('jobs', 'system_details')) return;
  await knex.schema.alterTable('jobs', (t) => {
    t.json('system_details').nullable().after('survey');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('jobs', (t) => {
    t.dropColumn('system_details');
  });
}
