import type { Knex } from 'knex';

const before = ['inspection_due', 'mot_due', 'service_due', 'van_below_minimum', 'depot_reorder', 'batch_expiring'];

// Two changes that belong together (the kind and its switch); each is safe to run again after a
// half-finished attempt, since MariaDB commits DDL implicitly.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('reminders', (t) => {
    t.enum('kind', [...before, 'annual_check_due'])
      .notNullable()
      .alter();
  });
  if (!(await knex.schema.hasColumn('reminder_settings', 'annual_check_reminders'))) {
    await knex.schema.alterTable('reminder_settings', (t) => {
      t.boolean('annual_check_reminders').notNullable().defaultTo(true).after('stock_reminders');
    });
  }
}

export async function down(knex: Knex): Promise<void> {
  const ids = knex('reminders').where('kind', 'annual_check_due').select('id');
  await knex('reminder_deliveries').whereIn('reminder_id', ids).delete();
  await knex('reminders').where('kind', 'annual_check_due').delete();
  await knex.schema.alterTable('reminders', (t) => {
    t.enum('kind', before).notNullable().alter();
  });
  if (await knex.schema.hasColumn('reminder_settings', 'annual_check_reminders')) {
    await knex.schema.alterTable('reminder_settings', (t) => {
      t.dropColumn('annual_check_reminders');
    });
  }
}
