import type { Knex } from 'knex';

const before = [
  'inspection_due',
  'mot_due',
  'service_due',
  'van_below_minimum',
  'depot_reorder',
  'batch_expiring',
  'annual_check_due',
];

// Overdue invoices are chased through the reminder machinery: one reminder row per invoice per chase
// ('first', 'second'), so each is sent once (modules/money/invoice-reminders.ts).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('reminders', (t) => {
    t.enum('kind', [...before, 'invoice_overdue'])
      .notNullable()
      .alter();
  });
}

export async function down(knex: Knex): Promise<void> {
  const ids = knex('reminders').where('kind', 'invoice_overdue').select('id');
  await knex('reminder_deliveries').whereIn('reminder_id', ids).delete();
  await knex('reminders').where('kind', 'invoice_overdue').delete();
  await knex.schema.alterTable('reminders', (t) => {
    t.enum('kind', before).notNullable().alter();
  });
}
