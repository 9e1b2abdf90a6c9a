import type { Knex } from 'knex';

// Agitation time per survey radiator. The tool's vibration magnitude is copied in when recorded, so a
// later change of the kit setting does not rewrite an engineer's exposure history; recorded_on is the
// firm's calendar day, the unit of the HSE points day.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('job_agitations', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('job_id').unsigned().notNullable().references('jobs.id').onDelete('CASCADE');
    t.smallint('radiator_index').unsigned().notNullable();
    t.smallint('minutes').unsigned().notNullable();
    t.integer('kit_item_id').unsigned().nullable().references('kit_items.id');
    t.decimal('magnitude_ms2', 5, 2).nullable();
    t.integer('engineer_member_id').unsigned().nullable().references('memberships.id').onDelete('SET NULL');
    t.date('recorded_on').notNullable();
    t.integer('recorded_by_user_id').unsigned().notNullable().references('users.id');
    t.timestamp('recorded_at', { precision: 3 }).notNullable();
    t.unique(['firm_id', 'job_id', 'radiator_index']);
    t.index(['firm_id', 'engineer_member_id', 'recorded_on']);
    t.index(['firm_id', 'recorded_on']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('job_agitations');
}
