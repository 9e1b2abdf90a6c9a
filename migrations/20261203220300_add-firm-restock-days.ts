import type { Knex } from 'knex';

// The days of booked jobs the restock run covers (the firm's setting; 7 unless set).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('firms', (t) => {
    t.tinyint('restock_days').unsigned().notNullable().defaultTo(7);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('firms', (t) => {
    t.dropColumn('restock_days');
  });
}
