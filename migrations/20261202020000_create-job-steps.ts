import type { Knex } from 'knex';

// The steps of a visit ticked on the job sheet: one row per ticked step; unticking removes it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('job_steps', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('job_id').unsigned().notNullable().references('jobs.id').onDelete('CASCADE');
    t.string('step', 30).notNullable();
    t.timestamp('done_at', { precision: 3 }).notNullable();
    t.integer('done_by_user_id').unsigned().notNullable().references('users.id');
    t.unique(['firm_id', 'job_id', 'step']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('job_steps');
}
