import type { Knex } from 'knex';

// The columns connect-session-knex expects (sid, sess, expired), made here so the store never
// creates tables at run time (its own creation step stays broken if the database is down at boot).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sessions', (t) => {
    t.string('sid', 255).primary();
    t.json('sess').notNullable();
    t.dateTime('expired').notNullable().index();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sessions');
}
