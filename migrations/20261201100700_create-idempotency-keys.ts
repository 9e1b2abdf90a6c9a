import type { Knex } from 'knex';

// The first answer to a request carrying an Idempotency-Key, replayed to any retry of it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('idempotency_keys', (t) => {
    t.bigIncrements('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('user_id').unsigned().notNullable().references('users.id');
    t.string('idempotency_key', 100).notNullable();
    t.string('route', 120).notNullable();
    t.smallint('status_code').unsigned().notNullable();
    t.json('response_body').notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['firm_id', 'user_id', 'idempotency_key']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('idempotency_keys');
}
