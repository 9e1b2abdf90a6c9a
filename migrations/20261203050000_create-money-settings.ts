import type { Knex } from 'knex';

// A firm's money settings (one row per firm, made on first use): VAT registration, payment terms,
// quote validity and when overdue invoices are chased. Rates in basis points (2000 = 20%).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('money_settings', (t) => {
    t.integer('firm_id').unsigned().notNullable().primary().references('firms.id').onDelete('CASCADE');
    t.boolean('vat_registered').notNullable().defaultTo(false);
    t.string('vat_number', 20).nullable();
    t.integer('vat_rate_bp').unsigned().notNullable().defaultTo(2000);
    t.integer('payment_terms_days').unsigned().notNullable().defaultTo(14);
    t.integer('quote_validity_days').unsigned().notNullable().defaultTo(30);
    t.integer('first_reminder_days').unsigned().notNullable().defaultTo(7);
    t.integer('second_reminder_days').unsigned().notNullable().defaultTo(21);
    t.boolean('invoice_on_completion').notNullable().defaultTo(true);
    t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('money_settings');
}
