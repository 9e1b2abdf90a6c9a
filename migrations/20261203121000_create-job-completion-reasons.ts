import type { Knex } from 'knex';

// Why something was not done when a job was completed (short circulation, no water test,
// radiators without after readings or flush ticks, unsaved input): what was found and the
// engineer's reason, printed on the report.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('job_completion_reasons', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('job_id').unsigned().notNullable().references('jobs.id').onDelete('CASCADE');
    t.string('code', 30).notNullable();
    t.string('found', 500).notNullable();
    t.string('reason', 500).notNullable();
    t.unique(['firm_id', 'job_id', 'code']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('job_completion_reasons');
}
