import type { Knex } from 'knex';

// Our own reference for a payment, made before the checkout session and sent in its metadata (and used as the
// session's Idempotency-Key): a webhook finds its payment by it even when the session's row was never written.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('payments', (t) => {
    t.string('reference', 36).notNullable();
    t.unique(['reference']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('payments', (t) => {
    t.dropUnique(['reference']);
    t.dropColumn('reference');
  });
}
