import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('invitations', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.string('email', 254).notNullable();
    t.enum('role', ['owner', 'admin', 'stores', 'engineer']).notNullable();
    t.string('token_hash', 64).notNullable().unique();
    t.integer('invited_by_user_id').unsigned().notNullable().references('users.id');
    t.timestamp('expires_at', { precision: 3 }).notNullable();
    t.timestamp('accepted_at', { precision: 3 }).nullable();
    t.timestamp('withdrawn_at', { precision: 3 }).nullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['firm_id', 'email']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('invitations');
}
