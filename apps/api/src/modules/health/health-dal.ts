import type { Knex } from 'knex';

/** Throws when the database cannot be reached (the error handler answers 503). */
export async function pingDatabase(db: Knex): Promise<void> {
  await db.raw('select 1');
}
