import type { Knex } from 'knex';

// Off unless the firm turns it on: e-mailing a firm's customers is the firm's choice, not ours.
export async function up(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasColumn('reminder_settings', 'annual_check_customer_emails'))) {
    await knex.schema.alterTable('reminder_settings', (t) => {
      t.boolean('annual_check_customer_emails').notNullable().defaultTo(false).after('annual_check_reminders');
    });
  }
}

export async function down(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('reminder_settings', 'annual_check_customer_emails')) {
    await knex.schema.alterTable('reminder_settings', (t) => {
      t.dropColumn('annual_check_customer_emails');
    });
  }
}
