import type { Knex } from 'knex';

// The link in each marketing e-mail: a long random token that does one thing, unsubscribe one address from one
// firm, without signing in. Only its SHA-256 is kept (lib/tokens.ts), so a leaked table unsubscribes nobody.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('unsubscribe_tokens', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.specificType('token_hash', 'CHAR(64)').notNullable().unique();
    t.string('email', 254).notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp('used_at', { precision: 3 }).nullable();
    t.index(['firm_id', 'email'], 'unsubscribe_tokens_firm_email');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('unsubscribe_tokens');
}
