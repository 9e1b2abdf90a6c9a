import type { Knex } from 'knex';

// One row per thing reminded per due period: the unique key is what makes a retried or
// duplicated scan send nothing twice.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('reminders', (t) => {
    t.bigIncrements('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.enum('kind', ['inspection_due', 'mot_due', 'service_due']).notNullable();
    t.string('subject_type', 20).notNullable();
    t.integer('subject_id').unsigned().notNullable();
    t.string('period_key', 40).notNullable();
    t.string('summary', 300).notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['firm_id', 'kind', 'subject_type', 'subject_id', 'period_key']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('reminders');
}
