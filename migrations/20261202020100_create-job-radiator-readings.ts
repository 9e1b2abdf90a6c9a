import type { Knex } from 'knex';

// Surface temperatures of one survey radiator (by its place in the survey), before or after the clean.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('job_radiator_readings', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('job_id').unsigned().notNullable().references('jobs.id').onDelete('CASCADE');
    t.smallint('radiator_index').unsigned().notNullable();
    t.enum('phase', ['before', 'after']).notNullable();
    t.decimal('top_c', 4, 1).notNullable();
    t.decimal('bottom_c', 4, 1).notNullable();
    t.decimal('flow_c', 4, 1).nullable();
    t.decimal('return_c', 4, 1).nullable();
    t.decimal('room_c', 4, 1).nullable();
    t.integer('recorded_by_user_id').unsigned().notNullable().references('users.id');
    t.timestamp('recorded_at', { precision: 3 }).notNullable();
    t.unique(['firm_id', 'job_id', 'radiator_index', 'phase']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('job_radiator_readings');
}
