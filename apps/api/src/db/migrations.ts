import { readdir } from 'node:fs/promises';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Knex } from 'knex';

export const repoRoot = path.resolve(import.meta.dirname, '../../../..');
export const migrationsDir = path.join(repoRoot, 'migrations');

// Our own source rather than knex's directory loader: knex's plain import() cannot load .ts files
// under Vitest, while an import() from this file goes through whichever loader runs the app.
const migrationSource: Knex.MigrationSource<string> = {
  async getMigrations() {
    return (await readdir(migrationsDir)).filter((f) => /^\d{14}_[a-z0-9-]+\.ts$/.test(f)).sort();
  },
  getMigrationName: (file) => file,
  getMigration: (file) => import(pathToFileURL(path.join(migrationsDir, file)).href) as Promise<Knex.Migration>,
};

export const migrationConfig: Knex.MigratorConfig = { migrationSource, tableName: 'knex_migrations' };

export async function migrateLatest(db: Knex): Promise<string[]> {
  const [, applied] = (await db.migrate.latest(migrationConfig)) as [number, string[]];
  return applied;
}

/** Drops every table of the connected database; for db:reset and the tests' fresh start. */
export async function dropAllTables(db: Knex): Promise<void> {
  const rows: { name: string }[] = (
    await db.raw('SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE()')
  )[0];
  if (rows.length === 0) return;
  await db.raw('SET FOREIGN_KEY_CHECKS = 0');
  try {
    for (const { name } of rows) await db.raw('DROP TABLE IF EXISTS ??', [name]);
  } finally {
    await db.raw('SET FOREIGN_KEY_CHECKS = 1');
  }
}
