import type { Knex } from 'knex';

// When each survey radiator was flushed until clear: the visit's flush step, radiator by radiator.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('job_radiator_flushes', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('job_id').unsigned().notNullable().references('jobs.id').onDelete('CASCADE');
    t.smallint('radiator_index').unsigned().notNullable();
    t.timestamp('flushed_at', { precision: 3 }).notNullable();
    t.integer('flushed_by_user_id').unsigned().notNullable().references('users.id');
    t.unique(['firm_id', 'job_id', 'radiator_index']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('job_radiator_flushes');
}
