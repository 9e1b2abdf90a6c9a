import type { Knex } from 'knex';

// A booked job may be cancelled (with a reason, stored beside it in the next migration).
export async function up(knex: Knex): Promise<void> {
  await knex.raw("ALTER TABLE jobs MODIFY status ENUM('planned', 'completed', 'cancelled') NOT NULL DEFAULT 'planned'");
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw("ALTER TABLE jobs MODIFY status ENUM('planned', 'completed') NOT NULL DEFAULT 'planned'");
}
