import { mkdir, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { env } from '../config/env.ts';
import { createKnex } from './knex.ts';
import { dropAllTables, migrateLatest, migrationsDir } from './migrations.ts';
import { seedDemoFirms } from './seed-demo.ts';

const migrationTemplate = `import type { Knex } from 'knex';

// MariaDB commits DDL implicitly: a failed migration is not rolled back, so make one change per file.
export async function up(knex: Knex): Promise<void> {
}

export async function down(knex: Knex): Promise<void> {
}
`;

function timestamp(d = new Date()): string {
  return d.toISOString().replace(/[-:T]/g, '').slice(0, 14);
}

async function main(): Promise<void> {
  const [command, name] = process.argv.slice(2);
  if (command === 'make') {
    if (!name || !/^[a-z0-9-]+$/.test(name))
      throw new Error('Usage: npm run db:make -- NAME (kebab-case, e.g. create-vans)');
    await mkdir(migrationsDir, { recursive: true });
    const file = path.join(migrationsDir, `${timestamp()}_${name}.ts`);
    await writeFile(file, migrationTemplate, { flag: 'wx' });
    console.log(`Created ${path.relative(process.cwd(), file)}`);
    return;
  }
  const db = createKnex(env());
  try {
    if (command === 'migrate') {
      const applied = await migrateLatest(db);
      console.log(applied.length ? `Migrated: ${applied.length} new migration(s).` : 'Database is up to date.');
    } else if (command === 'seed') {
      const result = await seedDemoFirms(db);
      console.log(result === 'seeded' ? 'Seeded the demo firms.' : 'Demo firms already present.');
    } else if (command === 'reset') {
      await dropAllTables(db);
      await migrateLatest(db);
      await seedDemoFirms(db);
      console.log('Database dropped, migrated and seeded.');
    } else {
      throw new Error('Usage: db-cli.ts migrate | seed | reset | make NAME');
    }
  } finally {
    await db.destroy();
  }
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
