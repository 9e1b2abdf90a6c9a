import type { Knex } from 'knex';

const fleetKinds = ['inspection_due', 'mot_due', 'service_due'];
const stockKinds = ['van_below_minimum', 'depot_reorder', 'batch_expiring'];

// Two changes in one file, as both belong to the stock reminders. MariaDB commits DDL implicitly, so
// each step is written to be safe to run again after a half-finished attempt: widening the enum to
// the same list is a no-op, and the column is only added when missing.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('reminders', (t) => {
    t.enum('kind', [...fleetKinds, ...stockKinds])
      .notNullable()
      .alter();
  });
  if (!(await knex.schema.hasColumn('reminder_settings', 'stock_reminders'))) {
    await knex.schema.alterTable('reminder_settings', (t) => {
      t.boolean('stock_reminders').notNullable().defaultTo(true).after('van_reminders');
    });
  }
}

// Narrowing the enum would fail on (or mangle) stock reminder rows, so those go first with their
// delivery records; the e-mails themselves stay in the outbox.
export async function down(knex: Knex): Promise<void> {
  const stockReminderIds = knex('reminders').whereIn('kind', stockKinds).select('id');
  await knex('reminder_deliveries').whereIn('reminder_id', stockReminderIds).delete();
  await knex('reminders').whereIn('kind', stockKinds).delete();
  await knex.schema.alterTable('reminders', (t) => {
    t.enum('kind', fleetKinds).notNullable().alter();
  });
  if (await knex.schema.hasColumn('reminder_settings', 'stock_reminders')) {
    await knex.schema.alterTable('reminder_settings', (t) => {
      t.dropColumn('stock_reminders');
    });
  }
}
