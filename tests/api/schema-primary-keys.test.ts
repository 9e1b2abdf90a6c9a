import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './support/test-app.ts';

// Galera replicates row changes by primary key: a table without one is refused or replicated unreliably, and only
// InnoDB tables are replicated at all (MariaDB Knowledge Base, "MariaDB Galera Cluster Known Limitations").
// The migrated test database is the schema every deployment gets (docker-notes/README.md, "MariaDB").
describe('every table suits a Galera cluster', () => {
  let t: TestApp;
  let tables: { name: string; engine: string; primaryKeyColumns: number }[];

  beforeAll(async () => {
    t = createTestApp();
    const [rows] = (await t.deps.db.raw(
      `SELECT t.TABLE_NAME AS name, t.ENGINE AS engine,
              (SELECT COUNT(*) FROM information_schema.KEY_COLUMN_USAGE k
                WHERE k.TABLE_SCHEMA = t.TABLE_SCHEMA AND k.TABLE_NAME = t.TABLE_NAME
                  AND k.CONSTRAINT_NAME = 'PRIMARY') AS primaryKeyColumns
         FROM information_schema.TABLES t
        WHERE t.TABLE_SCHEMA = DATABASE() AND t.TABLE_TYPE = 'BASE TABLE'
        ORDER BY t.TABLE_NAME`,
    )) as unknown as [{ name: string; engine: string; primaryKeyColumns: number | string }[]];
    tables = rows.map((r) => ({ ...r, primaryKeyColumns: Number(r.primaryKeyColumns) }));
  });
  afterAll(() => t.close());

  it('finds the migrated tables (the check looks at the real schema)', () => {
    const names = tables.map((x) => x.name);
    for (const expected of ['firms', 'users', 'sessions', 'stock_movements', 'stock_balances', 'knex_migrations']) {
      expect(names).toContain(expected);
    }
  });

  it('gives every table a primary key', () => {
    expect(tables.filter((x) => x.primaryKeyColumns === 0).map((x) => x.name)).toEqual([]);
  });

  it('keeps every table in InnoDB', () => {
    expect(tables.filter((x) => x.engine !== 'InnoDB').map((x) => `${x.name} (${x.engine})`)).toEqual([]);
  });
});
