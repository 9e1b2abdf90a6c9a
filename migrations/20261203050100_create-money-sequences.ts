import type { Knex } from 'knex';

// The gap-free numbers per firm: one counter row per firm and kind (invoice, credit note, quote),
// incremented under its row lock in the transaction that issues the document, so a rolled-back issue
// gives its number back and concurrent issues queue on the row: 1, 2, 3 with no gap and no repeat.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('money_sequences', (t) => {
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.enum('kind', ['invoice', 'credit_note', 'quote']).notNullable();
    t.integer('last_number').unsigned().notNullable().defaultTo(0);
    t.primary(['firm_id', 'kind']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('money_sequences');
}
