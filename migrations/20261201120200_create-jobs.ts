import type { Knex } from 'knex';

// A cleaning visit. The survey is kept whole as the engineer entered it (validated by the domain's
// surveySchema); the volume and dose plan are computed from it, never stored apart from it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('jobs', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('site_id').unsigned().notNullable().references('sites.id');
    t.integer('engineer_member_id').unsigned().nullable().references('memberships.id').onDelete('SET NULL');
    t.integer('van_location_id').unsigned().nullable().references('locations.id');
    t.date('scheduled_on').notNullable();
    t.enum('status', ['planned', 'completed']).notNullable().defaultTo('planned');
    t.json('survey').notNullable();
    t.timestamp('completed_at', { precision: 3 }).nullable();
    t.integer('completed_by_user_id').unsigned().nullable().references('users.id');
    t.date('next_check_on').nullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['firm_id', 'scheduled_on']);
    t.index(['firm_id', 'site_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('jobs');
}
