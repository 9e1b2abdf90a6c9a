import type { Knex } from 'knex';

// The customer's drawn signatures on a visit: the acknowledgement before the work and the
// acceptance after it, each a PNG in the object store with the printed name and the time.
// Signing the same kind again replaces it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('job_signatures', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('job_id').unsigned().notNullable().references('jobs.id').onDelete('CASCADE');
    t.enum('kind', ['acknowledgement', 'acceptance']).notNullable();
    t.string('signer_name', 120).notNullable();
    t.string('object_key', 200).notNullable();
    t.integer('byte_size').unsigned().notNullable();
    t.timestamp('signed_at', { precision: 3 }).notNullable();
    t.integer('recorded_by_user_id').unsigned().notNullable().references('users.id');
    t.unique(['firm_id', 'job_id', 'kind']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('job_signatures');
}
