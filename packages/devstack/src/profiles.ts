import { join } from 'node:path';
import { repoRoot } from './repo-root.ts';

export type ProfileName = 'dev' | 'test' | 'drill';

export interface Profile {
  name: ProfileName;
  nodeEnv: 'development' | 'test';
  dataDir: string;
  mariadb: { dataDir: string; port: number; dbName: string; extraArgs: string[] };
  redis: { dataDir: string; port: number };
  smtpPort: number;
  s3: { dataDir: string; port: number; bucket: string; region: string };
  /** The local payment stand-in (packages/payfake): the SDK's API, hosted pages and signed webhooks. */
  payfake: { port: number };
  appPort: number;
  outboxDir: string;
  /** Where the built client goes and the server serves it from. */
  distDir: string;
  logDir: string;
  logLevel: 'info' | 'warn';
}

export const databaseUser = 'heatfleet';
// A fixed password is fine: both instances listen on 127.0.0.1 only and hold invented data.
export const databasePassword = 'heatfleet-local';

function appPortFromEnv(fallback: number): number {
  const raw = process.env.PORT;
  if (raw === undefined || raw === '') return fallback;
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 1 || port > 65534) {
    throw new Error(`PORT must be a whole number from 1 to 65534, got "${raw}".`);
  }
  return port;
}

/**
 * HEATFLEET_TEST_SLOT=1..9 gives `npm test` its own ports (each + slot x 100), data folder and built client, so
 * several engineers can run tests in one checkout at once. Unset (slot 0) is the usual stack CI runs.
 */
function testSlot(): number {
  const raw = process.env.HEATFLEET_TEST_SLOT;
  if (raw === undefined || raw === '' || raw === '0') return 0;
  const slot = Number(raw);
  if (!Number.isInteger(slot) || slot < 1 || slot > 9) {
    throw new Error(`HEATFLEET_TEST_SLOT must be a whole number from 1 to 9, got "${raw}".`);
  }
  return slot;
}

export function getProfile(name: ProfileName): Profile {
  const slot = name === 'test' ? testSlot() : 0;
  const dataDir = join(repoRoot, '.data', slot === 0 ? name : `${name}-slot-${slot}`);
  const common = {
    dataDir,
    outboxDir: join(dataDir, 'outbox'),
    logDir: join(dataDir, 'logs'),
  };
  const s3 = (port: number) => ({
    dataDir: join(dataDir, 's3'),
    port,
    bucket: 'heatfleet-photos',
    region: 'eu-west-2',
  });
  if (name === 'dev') {
    return {
      ...common,
      name,
      nodeEnv: 'development',
      mariadb: { dataDir: join(dataDir, 'mariadb'), port: 3406, dbName: 'heatfleet', extraArgs: [] },
      redis: { dataDir: join(dataDir, 'redis'), port: 6479 },
      smtpPort: 2525,
      s3: s3(4569),
      payfake: { port: 12111 },
      appPort: appPortFromEnv(5173),
      distDir: join(repoRoot, 'dist'),
      logLevel: 'info',
    };
  }
  if (name === 'drill') {
    // npm run drill kills and restarts each part, so it gets its own ports and data, never the developer's
    // (nor npm run bench's, which holds 3408, 6481, 5193 and 5194).
    return {
      ...common,
      name,
      nodeEnv: 'development',
      mariadb: { dataDir: join(dataDir, 'mariadb'), port: 3410, dbName: 'heatfleet_drill', extraArgs: [] },
      redis: { dataDir: join(dataDir, 'redis'), port: 6483 },
      smtpPort: 2529,
      s3: s3(4573),
      payfake: { port: 12119 },
      appPort: 5196,
      distDir: join(repoRoot, 'dist'),
      logLevel: 'warn',
    };
  }
  return {
    ...common,
    name,
    nodeEnv: 'test',
    mariadb: {
      dataDir: join(dataDir, 'mariadb'),
      port: 3407 + slot * 100,
      dbName: 'heatfleet_test',
      // Test data is thrown away each run: trading crash durability for faster commits is fine here.
      extraArgs: ['--innodb-flush-log-at-trx-commit=2', '--sync-binlog=0'],
    },
    redis: { dataDir: join(dataDir, 'redis'), port: 6480 + slot * 100 },
    smtpPort: 2526 + slot * 100,
    s3: s3(4570 + slot * 100),
    payfake: { port: 12112 + slot * 100 },
    appPort: 5183 + slot * 100,
    // The same dist/ as `npm start`: a folder under .data would trip express's sendFile, which refuses
    // any path with a dot-folder in it unless given a root.
    distDir: join(repoRoot, slot === 0 ? 'dist' : `dist-slot-${slot}`),
    logLevel: 'warn',
  };
}
