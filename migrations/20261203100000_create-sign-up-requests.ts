import type { Knex } from 'knex';

// Not tenant data: a sign-up waits for its e-mail to be confirmed before any firm exists.
// Only the token's hash is kept, as for password resets.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sign_up_requests', (t) => {
    t.increments('id').primary();
    t.string('email', 254).notNullable();
    t.string('name', 120).notNullable();
    t.string('firm_name', 120).notNullable();
    t.string('password_hash', 255).notNullable();
    t.string('token_hash', 64).notNullable().unique();
    t.timestamp('expires_at', { precision: 3 }).notNullable();
    t.timestamp('used_at', { precision: 3 }).nullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['email']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sign_up_requests');
}
