import type { Knex } from 'knex';

// The SHA-256 of the request a key was first used for, so a key sent back with another body is refused.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('idempotency_keys', (t) => {
    t.string('request_hash', 64).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('idempotency_keys', (t) => {
    t.dropColumn('request_hash');
  });
}
