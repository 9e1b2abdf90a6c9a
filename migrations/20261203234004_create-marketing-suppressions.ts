import type { Knex } from 'knex';

// The firm's suppression list (Privacy and Electronic Communications (EC Directive) Regulations 2003, regulation 22):
// an address here is never sent the firm's marketing e-mails again (the annual check offer). One row per firm and
// address; `source` says how it got here (the link in an e-mail, or the office adding it).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('marketing_suppressions', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.string('email', 254).notNullable();
    t.string('source', 20).notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['firm_id', 'email'], { indexName: 'marketing_suppressions_firm_email' });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('marketing_suppressions');
}
