import type { Knex } from 'knex';

// The lines of a quote: description, whole quantity, unit price without VAT, the VAT rate (basis
// points), the net amount and the line's VAT (packages/domain/src/money/vat-lines.ts: per line, nearest penny).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('quote_lines', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('quote_id').unsigned().notNullable().references('quotes.id').onDelete('CASCADE');
    t.integer('position').unsigned().notNullable();
    t.enum('kind', ['visit', 'chemical', 'extra', 'other']).notNullable();
    t.integer('price_item_id').unsigned().nullable();
    t.integer('product_id').unsigned().nullable();
    t.string('description', 200).notNullable();
    t.integer('quantity').unsigned().notNullable();
    t.integer('unit_pence').notNullable();
    t.integer('vat_rate_bp').unsigned().notNullable();
    t.integer('net_pence').notNullable();
    t.integer('vat_pence').notNullable();
    t.index(['firm_id', 'quote_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('quote_lines');
}
