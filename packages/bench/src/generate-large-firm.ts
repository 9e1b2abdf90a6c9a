import { existsSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { pathToFileURL } from 'node:url';
import { createPool } from 'mysql2/promise';
import { createKnex } from '@heatfleet/api/db/knex.ts';
import { migrateLatest } from '@heatfleet/api/db/migrations.ts';
import { seedDemoFirms } from '@heatfleet/api/db/seed-demo.ts';
import { hashPassword } from '@heatfleet/api/modules/auth/password.ts';
import { ensureDatabase } from '@heatfleet/devstack/src/mariadb.ts';
import { benchDatabase, benchStack, startBenchMariadb, stopBenchMariadb } from './bench-stack.ts';
import { balancesDisagreeingWithLedger, generateFirm, type FirmSpec, type GeneratedFirm } from './large-firm.ts';

/** The bench firms' members all sign in with this invented password. */
export const benchPassword = 'heatfleet-bench-2026';

// Same vans and products in all three, so the only thing that grows between them is the ledger.
export const benchFirms: FirmSpec[] = [
  {
    key: 'large',
    name: 'Quillmere Heating Group',
    domain: 'quillmere.example',
    vans: 200,
    products: 100,
    movements: 1_000_000,
    kitItems: 5_000,
    jobs: 20_000,
  },
  {
    key: 'medium',
    name: 'Fernlow Heating Services',
    domain: 'fernlow.example',
    vans: 200,
    products: 100,
    movements: 100_000,
    kitItems: 500,
    jobs: 2_000,
  },
  {
    key: 'small',
    name: 'Wrenbeck Heating',
    domain: 'wrenbeck.example',
    vans: 200,
    products: 100,
    movements: 10_000,
    kitItems: 500,
    jobs: 2_000,
  },
];

export interface GeneratedDatabase {
  generatedAt: string;
  seconds: number;
  password: string;
  firms: GeneratedFirm[];
}

/** Recreates the bench database from nothing: migrated, the demo firms seeded, then the three bench firms. */
export async function generateBenchDatabase(): Promise<GeneratedDatabase> {
  const began = Date.now();
  rmSync(benchStack.generatedMarker, { force: true });
  await ensureDatabase(benchStack.mariadb, { dbName: benchStack.mariadb.dbName, recreate: true });
  const db = createKnex(benchDatabase);
  const pool = createPool({ ...connection(), connectionLimit: 3 });
  try {
    process.stdout.write('Migrating and seeding the demo firms…\n');
    await migrateLatest(db);
    await seedDemoFirms(db);
    const passwordHash = await hashPassword(benchPassword);
    const now = new Date();
    const firms: GeneratedFirm[] = [];
    // BENCH_SCALE=0.01 builds a small copy quickly, for trying the bench itself out.
    const scale = Number(process.env.BENCH_SCALE ?? '1');
    for (const [n, spec] of benchFirms.entries()) {
      const scaled = {
        ...spec,
        movements: Math.round(spec.movements * scale),
        kitItems: Math.round(spec.kitItems * scale),
        jobs: Math.round(spec.jobs * scale),
      };
      firms.push(await generateFirm(db, pool, scaled, passwordHash, now, 101 + n));
    }
    process.stdout.write('Checking every balance against its ledger…\n');
    for (const firm of firms) {
      const wrong = await balancesDisagreeingWithLedger(pool, firm.firmId);
      if (wrong > 0) throw new Error(`${firm.name}: ${wrong} balances disagree with their ledger.`);
    }
    await pool.query(
      'ANALYZE TABLE stock_movements, stock_balances, custody_events, kit_items, inspections, jobs, par_levels',
    );
    const result: GeneratedDatabase = {
      generatedAt: now.toISOString(),
      seconds: (Date.now() - began) / 1000,
      password: benchPassword,
      firms,
    };
    mkdirSync(dirname(benchStack.generatedMarker), { recursive: true });
    writeFileSync(benchStack.generatedMarker, `${JSON.stringify(result, null, 2)}\n`);
    process.stdout.write(`Bench database ready in ${result.seconds.toFixed(1)} s; every balance equals its ledger.\n`);
    return result;
  } finally {
    await pool.end();
    await db.destroy();
  }
}

export function connection() {
  return {
    host: benchDatabase.DATABASE_HOST,
    port: benchDatabase.DATABASE_PORT,
    user: benchDatabase.DATABASE_USER,
    password: benchDatabase.DATABASE_PASSWORD,
    database: benchDatabase.DATABASE_NAME,
    timezone: 'Z',
    dateStrings: ['DATE' as const],
  };
}

export function benchDatabaseIsGenerated(): boolean {
  return existsSync(benchStack.generatedMarker);
}

async function main(): Promise<void> {
  const mariadb = await startBenchMariadb();
  try {
    await generateBenchDatabase();
  } finally {
    await stopBenchMariadb(mariadb);
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  main().catch((error: unknown) => {
    process.stderr.write(`${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
    process.exit(1);
  });
}
