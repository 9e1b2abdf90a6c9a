import type { Knex } from 'knex';

// Depots and vans: the places kit and stock can be. A van has a registration, an engineer and due dates.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('locations', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.enum('kind', ['depot', 'van']).notNullable();
    t.string('name', 80).notNullable();
    t.string('registration', 10).nullable();
    t.integer('engineer_member_id').unsigned().nullable().references('memberships.id').onDelete('SET NULL');
    t.date('mot_due_on').nullable();
    t.date('service_due_on').nullable();
    t.string('notes', 1000).nullable();
    t.boolean('active').notNullable().defaultTo(true);
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['firm_id', 'name']);
    t.unique(['firm_id', 'registration']);
    t.index(['firm_id', 'kind']);
    t.index(['firm_id', 'engineer_member_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('locations');
}
