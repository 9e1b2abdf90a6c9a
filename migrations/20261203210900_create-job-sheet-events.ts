import type { Knex } from 'knex';

// Every job-sheet write as it arrived (readings, agitation, flush and step ticks, water tests), append-only: the
// sheet's own tables hold the latest by the engineer's tap time, and this keeps each of them, so a later value
// wins and the earlier one is still on record. `target` names what was written ("reading:3:before", "step:flush").
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('job_sheet_events', (t) => {
    t.bigIncrements('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('job_id').unsigned().notNullable().references('jobs.id').onDelete('CASCADE');
    t.string('target', 40).notNullable();
    t.json('value').notNullable();
    t.boolean('applied').notNullable();
    t.timestamp('tapped_at', { precision: 3 }).nullable();
    t.timestamp('recorded_at', { precision: 3 }).notNullable();
    t.integer('recorded_by_user_id').unsigned().notNullable().references('users.id');
    t.index(['firm_id', 'job_id', 'target'], 'job_sheet_events_target');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('job_sheet_events');
}
