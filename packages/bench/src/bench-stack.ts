import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import { startMariadb, stopMariadb, type MariadbInstance } from '@heatfleet/devstack/src/mariadb.ts';
import { databasePassword, databaseUser } from '@heatfleet/devstack/src/profiles.ts';
import { startRedis, stopRedis, type RedisInstance } from '@heatfleet/devstack/src/redis.ts';
import { repoRoot } from '@heatfleet/devstack/src/repo-root.ts';

// The bench keeps a MariaDB and a Redis of its own, beside the dev and test ones: the fault drills kill
// the dev database on purpose, the tests recreate theirs every run, and a million-row ledger should not
// sit in the database `npm start` shows.
const dataDir = join(repoRoot, '.data', 'bench');

export const benchStack = {
  dataDir,
  mariadb: {
    dataDir: join(dataDir, 'mariadb'),
    port: 3408,
    dbName: 'heatfleet_bench',
    // A production server sizes its buffer pool to hold the working set (the default 128 MB would not
    // hold a million movements and their indexes); durability stays at the default (flush at commit).
    extraArgs: ['--innodb-buffer-pool-size=1G'],
  },
  redis: { dataDir: join(dataDir, 'redis'), port: 6481 },
  apiPort: 5193,
  baselinePort: 5194,
  distDir: join(dataDir, 'dist'),
  logDir: join(dataDir, 'logs'),
  /** Written last by the generator; its absence means the database must be (re)generated. */
  generatedMarker: join(dataDir, 'generated.json'),
  resultsDir: join(repoRoot, 'bench', 'results'),
} as const;

export const benchDatabase = {
  DATABASE_HOST: '127.0.0.1',
  DATABASE_PORT: benchStack.mariadb.port,
  DATABASE_USER: databaseUser,
  DATABASE_PASSWORD: databasePassword,
  DATABASE_NAME: benchStack.mariadb.dbName,
};

export function startBenchMariadb(): Promise<MariadbInstance> {
  return startMariadb({
    dataDir: benchStack.mariadb.dataDir,
    port: benchStack.mariadb.port,
    dbName: benchStack.mariadb.dbName,
    extraArgs: [...benchStack.mariadb.extraArgs],
  });
}

export async function stopBenchMariadb(instance: MariadbInstance): Promise<void> {
  if (instance.startedHere) await stopMariadb(instance);
}

export function startBenchRedis(): Promise<RedisInstance> {
  return startRedis({ dataDir: benchStack.redis.dataDir, port: benchStack.redis.port });
}

export async function stopBenchRedis(instance: RedisInstance): Promise<void> {
  if (instance.startedHere) await stopRedis(instance);
}

/** What the API reads (apps/api/src/config/env.ts), production-like: no mail or object store is exercised. */
export function benchApiEnv(): Record<string, string> {
  return {
    NODE_ENV: 'production',
    // The API's heap cap, as in production (docker-notes): without it V8 grows a busy process's heap lazily, to
    // 450-800 MiB resident under this load; capped at 192 MiB the same loads ran at the same rate (README, "Round two").
    NODE_OPTIONS: '--max-old-space-size=192',
    // Two glibc malloc arenas, as in production (docker-notes): with the default the threads that compress large
    // answers keep memory that never returns (peak RSS 316 -> 250 MiB over three firms' restock runs and overviews).
    MALLOC_ARENA_MAX: '2',
    PORT: String(benchStack.apiPort),
    APP_ORIGIN: `http://127.0.0.1:${benchStack.apiPort}`,
    DATABASE_HOST: benchDatabase.DATABASE_HOST,
    DATABASE_PORT: String(benchDatabase.DATABASE_PORT),
    DATABASE_USER: benchDatabase.DATABASE_USER,
    DATABASE_PASSWORD: benchDatabase.DATABASE_PASSWORD,
    DATABASE_NAME: benchDatabase.DATABASE_NAME,
    REDIS_URL: `redis://127.0.0.1:${benchStack.redis.port}`,
    // Nothing listens here: the bench sends no e-mail, and a real deployment has its own relay.
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: '2599',
    S3_ENDPOINT: 'http://127.0.0.1:4599',
    SESSION_SECRET: randomBytes(32).toString('hex'),
    WEB_DIST_DIR: benchStack.distDir,
    LOG_LEVEL: 'info',
  };
}
