import knexFactory, { type Knex } from 'knex';
import type { Logger } from 'pino';
import type { Env } from '../config/env.ts';

export function createKnex(
  env: Pick<Env, 'DATABASE_HOST' | 'DATABASE_PORT' | 'DATABASE_USER' | 'DATABASE_PASSWORD' | 'DATABASE_NAME'>,
  logger?: Logger,
): Knex {
  return knexFactory({
    log: logger && {
      warn: (m: unknown) => logger.warn({ knex: String(m) }, 'knex warning'),
      error: (m: unknown) => logger.warn({ knex: String(m) }, 'knex error'),
      deprecate: (m: unknown) => logger.debug({ knex: String(m) }, 'knex deprecation'),
      debug: (m: unknown) => logger.debug({ knex: String(m) }, 'knex debug'),
    },
    client: 'mysql2',
    // charset is left unset on purpose: setting it overrides the database's collation.
    connection: {
      host: env.DATABASE_HOST,
      port: env.DATABASE_PORT,
      user: env.DATABASE_USER,
      password: env.DATABASE_PASSWORD,
      database: env.DATABASE_NAME,
      timezone: 'Z',
      // DATE columns are calendar days: keep them as 'YYYY-MM-DD' rather than midnight instants
      // (mysql2 takes a list of types here; knex's typings only know the boolean form).
      dateStrings: ['DATE'] as unknown as boolean,
      supportBigNumbers: true,
      bigNumberStrings: false,
      connectTimeout: 3000,
    },
    // A short acquire timeout turns "database down" into a prompt 503 instead of a hung request.
    pool: { min: 0, max: 10 },
    acquireConnectionTimeout: 4000,
  });
}
